import { exportPaths } from '../lib/invoice-links';

const link = 'inline-flex items-center rounded-lg border border-line bg-panel px-3 py-1.5 text-sm font-semibold hover:bg-sunk';

/** CSV downloads (RFC 4180) of the invoices the viewer may see and, for finance and admin, the cost-centre journal. */
export function ExportLinks({ journal }: { journal: boolean }) {
  return (
    <div className="flex flex-wrap gap-2">
      <a href={exportPaths.invoicesCsv} download data-testid="export-invoices-csv" className={link}>
        Invoices CSV
      </a>
      {journal && (
        <a href={exportPaths.journalCsv} download data-testid="export-journal-csv" className={link}>
          Journal CSV
        </a>
      )}
    </div>
  );
}
