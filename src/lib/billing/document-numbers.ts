// How invoice and credit note numbers read. The number itself is an integer allocated without gaps
// per organisation and series (lib/server/document-numbers); this is only its printed form.
import type { DocumentSeries } from '../../db/schema/billing';

const PREFIX: Record<DocumentSeries, string> = { invoice: 'INV', credit_note: 'CRN' };

export function formatDocumentNumber(series: DocumentSeries, number: number): string {
  return `${PREFIX[series]}-${String(number).padStart(5, '0')}`;
}
