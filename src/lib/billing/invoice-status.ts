// What may happen to an invoice in each status. A sent invoice is a legal record: it is never
// edited, only paid or credited in full (which voids it) so a corrected one can be issued.
import type { InvoiceStatus } from '../../db/schema/billing';

export type InvoiceAction = 'edit' | 'discard' | 'send' | 'pay' | 'credit';

const ALLOWED: Record<InvoiceStatus, readonly InvoiceAction[]> = {
  draft: ['edit', 'discard', 'send'],
  sent: ['pay', 'credit'],
  paid: [],
  void: [],
};

export function invoiceAllows(status: InvoiceStatus, action: InvoiceAction): boolean {
  return ALLOWED[status].includes(action);
}

const REFUSAL: Record<InvoiceAction, string> = {
  edit: 'Only a draft can be changed. To correct a sent invoice, credit it and issue a new one.',
  discard: 'Only a draft can be discarded; a sent invoice keeps its number and is credited instead.',
  send: 'This invoice has already been sent.',
  pay: 'Only a sent, unpaid invoice can be paid.',
  credit: 'Only a sent, unpaid invoice can be credited. Refunds of paid invoices are made outside Tickover.',
};

export function invoiceRefusal(status: InvoiceStatus, action: InvoiceAction): string {
  return `${REFUSAL[action]} (It is ${status}.)`;
}
