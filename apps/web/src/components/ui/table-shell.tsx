import type { ReactNode } from 'react';

/** Frame for data tables: a toolbar row, a scrollable table and an empty state. */
export function TableShell({
  toolbar,
  children,
  empty,
  isEmpty,
  caption,
  testId,
}: {
  toolbar?: ReactNode;
  children: ReactNode;
  empty?: ReactNode;
  isEmpty?: boolean;
  caption: string;
  testId?: string;
}) {
  return (
    <div className="overflow-hidden rounded-xl border border-line bg-panel">
      {toolbar && <div className="flex flex-wrap items-end gap-3 border-b border-line px-4 py-3">{toolbar}</div>}
      <div className="overflow-x-auto">
        <table data-testid={testId} className="w-full border-collapse text-left text-sm">
          <caption className="sr-only">{caption}</caption>
          {children}
        </table>
      </div>
      {isEmpty && <div className="px-4 py-10 text-center text-sm text-ink-muted">{empty}</div>}
    </div>
  );
}
