import type { MigrationInterface, QueryRunner } from 'typeorm';

/** The PO number an invoice was issued against, kept as issued (the account's PO can change later). */
export class InvoicePoNumber1765500000000 implements MigrationInterface {
  name = 'InvoicePoNumber1765500000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE invoices ADD COLUMN po_number text`);
    await q.query(`UPDATE invoices i SET po_number = a.po_number FROM accounts a WHERE a.id = i.account_id AND i.kind = 'external'`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE invoices DROP COLUMN IF EXISTS po_number`);
  }
}
