import { type ReactNode, Suspense } from 'react';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { PartLoadBoundary, lazyPart } from '../../../components/ui/lazy-part';
import { Notice } from '../../../components/ui/notice';
import { Spinner } from '../../../components/ui/spinner';
import type { RequestFormProps } from '../../../features/bookings/components/request-form';
import { BookingEstimate } from '../../../features/estimates/components/booking-estimate';
import type { MaintenanceFormProps } from '../../../features/maintenance/components/maintenance-form';

// The forms bring react-hook-form, zod and the shared schemas: about a fifth of the page's script, needed only
// once a slot is picked, so they stay out of the calendar's first load.
const loadRequestForm = () => import('../../../features/bookings/components/request-form');
const loadMaintenanceForm = () => import('../../../features/maintenance/components/maintenance-form');

const LazyRequestForm = lazyPart(() => loadRequestForm().then((m) => m.RequestForm));
const LazyMaintenanceForm = lazyPart(() => loadMaintenanceForm().then((m) => m.MaintenanceForm));

/** Fetches both forms ahead of need; the browser keeps the module, so a later open does not wait. */
export function preloadCalendarForms(): void {
  // a failed preload is retried by React.lazy when the form is opened, and reported there
  loadRequestForm().catch(() => undefined);
  loadMaintenanceForm().catch(() => undefined);
}

/** Runs the preload once the browser is idle, so it never competes with drawing the week. */
export function preloadCalendarFormsWhenIdle(): () => void {
  if (typeof window.requestIdleCallback === 'function') {
    const handle = window.requestIdleCallback(preloadCalendarForms, { timeout: 3000 });
    return () => window.cancelIdleCallback(handle);
  }
  const handle = window.setTimeout(preloadCalendarForms, 500);
  return () => window.clearTimeout(handle);
}

interface ShellProps {
  title: string;
  onClose: () => void;
  size?: 'md' | 'lg';
}

function FormLoading(props: ShellProps) {
  return (
    <Dialog open onClose={props.onClose} title={props.title} size={props.size} testId="form-loading">
      <div role="status" className="flex min-h-40 items-center justify-center gap-3 text-sm text-ink-muted">
        <Spinner />
        <span>Opening the form…</span>
      </div>
    </Dialog>
  );
}

function FormLoadFailed(props: ShellProps) {
  return (
    <Dialog open onClose={props.onClose} title={props.title} size={props.size} testId="form-load-failed">
      <Notice tone="danger" title="The form could not be loaded">
        Femtoslot could not fetch part of the page. Check your connection and reload.
      </Notice>
      <div className="mt-4 flex justify-end gap-2">
        <Button variant="secondary" onClick={props.onClose}>
          Close
        </Button>
        <Button onClick={() => window.location.reload()}>Reload</Button>
      </div>
    </Dialog>
  );
}

function LazyForm(props: ShellProps & { children: ReactNode }) {
  const { children, ...shell } = props;
  return (
    <PartLoadBoundary failed={<FormLoadFailed {...shell} />}>
      <Suspense fallback={<FormLoading {...shell} />}>{children}</Suspense>
    </PartLoadBoundary>
  );
}

export function RequestFormDialog(props: RequestFormProps) {
  return (
    <LazyForm title="Request beam time" size="lg" onClose={props.onClose}>
      <LazyRequestForm {...props} estimate={props.estimate ?? ((body) => <BookingEstimate body={body} timeZone={props.timeZone} />)} />
    </LazyForm>
  );
}

export function MaintenanceFormDialog(props: MaintenanceFormProps) {
  return (
    <LazyForm title={props.existing ? 'Maintenance window' : 'Block maintenance'} onClose={props.onClose}>
      <LazyMaintenanceForm {...props} />
    </LazyForm>
  );
}
