import type { APIRoute } from 'astro';
import { getDb } from '../../../db/client';
import { endpoint, HttpError } from '../../../lib/server/http';
import { recordTokenParam } from '../../../lib/server/follow-up-schemas';
import { resolveRecordToken } from '../../../lib/server/record-links';
import { loadServiceRecord } from '../../../lib/server/service-record';
import { renderRecordPdf } from '../../../lib/server/record-pdf';
import { recordPhotoBytes } from '../../../lib/server/record-photos';

export const prerender = false;

/** The service record as a PDF, for the customer holding the signed link. */
export const GET: APIRoute = endpoint(async (context) => {
  const { token } = recordTokenParam.parse(context.params);
  const link = await resolveRecordToken(getDb(), token);
  const record = await loadServiceRecord(getDb(), link.organisationId, link.visitId);
  if (!record) throw new HttpError(404, 'This record is no longer available.');
  const pdf = await renderRecordPdf(record, (photoId) => recordPhotoBytes(link.visitId, photoId, 'thumb'));
  const filename = `service-record-${record.vehicle.registration}-${record.visit.date}.pdf`;
  return new Response(new Uint8Array(pdf), {
    headers: {
      'content-type': 'application/pdf',
      'content-disposition': `inline; filename="${filename}"`,
      'cache-control': 'private, no-store',
    },
  });
});
