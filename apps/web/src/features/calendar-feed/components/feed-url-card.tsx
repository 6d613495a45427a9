import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { useFeedUrl } from '../api/get-feed-url';
import { useRegenerateFeedUrl } from '../api/regenerate-feed-url';

/** The signed-in person's private iCalendar feed (RFC 5545): subscribe from any calendar program. */
export function FeedUrlCard() {
  const feed = useFeedUrl();
  const regenerate = useRegenerateFeedUrl();
  const url = feed.data ? new URL(feed.data, window.location.origin).toString() : '';
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(url);
      toast.success('Feed address copied');
    } catch {
      toast.error('Copying was refused by the browser; select the address and copy it by hand.');
    }
  };
  return (
    <section className="rounded-xl border border-line bg-panel px-4 py-3.5" data-testid="calendar-feed" aria-labelledby="feed-title">
      <h2 id="feed-title" className="text-sm font-semibold">
        Your calendar feed
      </h2>
      <p className="mt-0.5 text-xs text-ink-muted">
        Subscribe in your own calendar program to see your beam time. The address is private: anyone who has it can read the feed.
      </p>
      {feed.isError && <p className="mt-2 text-sm text-danger">{feed.error.message}</p>}
      {url && (
        <input
          readOnly
          value={url}
          aria-label="Calendar feed address"
          data-testid="calendar-feed-url"
          onFocus={(e) => e.currentTarget.select()}
          className="mt-2 block w-full truncate rounded-lg border border-line bg-sunk px-2.5 py-1.5 font-mono text-xs"
        />
      )}
      <div className="mt-2 flex gap-2">
        <Button size="sm" variant="secondary" disabled={!url} onClick={() => void copy()} data-testid="copy-feed-url">
          Copy
        </Button>
        <Button
          size="sm"
          variant="quiet"
          busy={regenerate.isPending}
          data-testid="regenerate-feed-url"
          onClick={() =>
            regenerate.mutate(undefined, {
              onSuccess: () => toast.success('New feed address made; the old one no longer works'),
              onError: (e) => toast.error(e.message),
            })
          }
        >
          Regenerate
        </Button>
      </div>
    </section>
  );
}
