// The e-mails we send, as HTML and plain text. HTML mail clients ignore style sheets and many
// ignore modern CSS, so the layout is one centred table with inline styles, and every message
// reads the same as plain text. Nothing is loaded from the network (no images, no fonts).
import type { Severity } from '../../../db/schema';
import { SEVERITY_DISPLAY } from '../../record/severity';

export type RenderedMail = { subject: string; html: string; text: string };

export type Business = { name: string; addressLines: string; phone: string; email: string };

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

const BRAND = '#0d5c63';
const INK = '#14202b';

// Each severity has a word and a shape as well as a colour (never colour alone).
const SEVERITY_WORDS = SEVERITY_DISPLAY;

type Block =
  | { kind: 'p'; text: string }
  | { kind: 'button'; label: string; url: string }
  | { kind: 'facts'; rows: [string, string][] }
  | { kind: 'severities'; rows: { severity: Severity; title: string }[] }
  | { kind: 'small'; text: string };

function htmlBlock(block: Block): string {
  switch (block.kind) {
    case 'p':
      return `<p style="margin:0 0 16px;font-size:17px;line-height:1.5;color:${INK}">${escapeHtml(block.text)}</p>`;
    case 'small':
      return `<p style="margin:0 0 12px;font-size:14px;line-height:1.5;color:#4a5560">${escapeHtml(block.text)}</p>`;
    case 'button':
      return `<table role="presentation" cellspacing="0" cellpadding="0" style="margin:8px 0 24px"><tr><td style="border-radius:8px;background:${BRAND}">
<a href="${escapeHtml(block.url)}" style="display:inline-block;padding:16px 28px;font-size:18px;font-weight:bold;color:#ffffff;text-decoration:none;border-radius:8px">${escapeHtml(block.label)}</a>
</td></tr></table>`;
    case 'facts':
      return `<table role="presentation" cellspacing="0" cellpadding="0" style="margin:0 0 20px;border-collapse:collapse;width:100%">${block.rows
        .map(
          ([k, v]) =>
            `<tr><td style="padding:6px 12px 6px 0;font-size:15px;color:#4a5560;white-space:nowrap;vertical-align:top">${escapeHtml(k)}</td><td style="padding:6px 0;font-size:16px;color:${INK};font-weight:bold">${escapeHtml(v)}</td></tr>`,
        )
        .join('')}</table>`;
    case 'severities':
      return `<table role="presentation" cellspacing="0" cellpadding="0" style="margin:0 0 20px;border-collapse:collapse;width:100%">${block.rows
        .map((r) => {
          const s = SEVERITY_WORDS[r.severity];
          return `<tr><td style="padding:6px 10px 6px 0;font-size:18px;color:${s.colour};vertical-align:top" aria-hidden="true">${s.mark}</td><td style="padding:6px 0;font-size:16px;color:${INK}"><strong style="color:${s.colour}">${escapeHtml(s.label)}:</strong> ${escapeHtml(r.title)}</td></tr>`;
        })
        .join('')}</table>`;
  }
}

function textBlock(block: Block): string {
  switch (block.kind) {
    case 'p':
    case 'small':
      return block.text;
    case 'button':
      return `${block.label}:\n${block.url}`;
    case 'facts':
      return block.rows.map(([k, v]) => `${k}: ${v}`).join('\n');
    case 'severities':
      return block.rows.map((r) => `- ${SEVERITY_WORDS[r.severity].label}: ${r.title}`).join('\n');
  }
}

function layout(business: Business, subject: string, blocks: Block[]): RenderedMail {
  const footer = [business.name, business.addressLines, [business.phone, business.email].filter(Boolean).join(' · ')].filter(Boolean);
  const html = `<!doctype html><html lang="en-GB"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>${escapeHtml(subject)}</title></head>
<body style="margin:0;padding:0;background:#f7f5f0">
<table role="presentation" width="100%" cellspacing="0" cellpadding="0" style="background:#f7f5f0"><tr><td align="center" style="padding:24px 12px">
<table role="presentation" width="100%" cellspacing="0" cellpadding="0" style="max-width:600px;background:#ffffff;border-radius:10px;font-family:Arial,Helvetica,sans-serif">
<tr><td style="background:${BRAND};color:#ffffff;padding:18px 24px;border-radius:10px 10px 0 0;font-size:20px;font-weight:bold">${escapeHtml(business.name)}</td></tr>
<tr><td style="padding:24px">${blocks.map(htmlBlock).join('\n')}</td></tr>
<tr><td style="padding:16px 24px 24px;border-top:1px solid #e3e0d8;font-size:13px;line-height:1.6;color:#4a5560">${footer.map(escapeHtml).join('<br>')}</td></tr>
</table></td></tr></table></body></html>`;
  const text = `${blocks.map(textBlock).join('\n\n')}\n\n--\n${footer.join('\n')}\n`;
  return { subject, html, text };
}

const firstName = (name: string) => name.trim().split(/\s+/)[0] ?? name;
const greeting = (name: string) => `Hello ${firstName(name)},`;

export function recordReadyMail(input: {
  business: Business;
  customerName: string;
  vehicle: string;
  registration: string;
  visitDate: string;
  findings: { severity: Severity; title: string }[];
  url: string;
  linkExpires: string;
}): RenderedMail {
  const attention = input.findings.filter((f) => f.severity !== 'ok');
  const blocks: Block[] = [
    { kind: 'p', text: greeting(input.customerName) },
    { kind: 'p', text: `Your ${input.vehicle} (${input.registration}) was serviced on ${input.visitDate}. The service record lists the work done, the readings taken and what we found.` },
  ];
  if (attention.length > 0) {
    blocks.push({ kind: 'p', text: 'We found:' }, { kind: 'severities', rows: attention });
    blocks.push({ kind: 'p', text: 'Where we have priced the work, you can approve or decline it on the record.' });
  } else {
    blocks.push({ kind: 'p', text: 'We found nothing that needs work.' });
  }
  blocks.push(
    { kind: 'button', label: 'Open your service record', url: input.url },
    { kind: 'small', text: `This link is yours alone and works until ${input.linkExpires}. You can save the record as a PDF from the page.` },
  );
  return layout(input.business, `Your service record for ${input.registration}, ${input.visitDate}`, blocks);
}

export function invoiceMail(input: {
  business: Business;
  customerName: string;
  invoiceNumber: string;
  registration: string;
  total: string;
  dueDate: string;
  url: string;
}): RenderedMail {
  return layout(input.business, `Invoice ${input.invoiceNumber} from ${input.business.name}: ${input.total}`, [
    { kind: 'p', text: greeting(input.customerName) },
    { kind: 'p', text: `Here is the invoice for the service of ${input.registration}.` },
    { kind: 'facts', rows: [['Invoice', input.invoiceNumber], ['Amount', input.total], ['Please pay by', input.dueDate]] },
    { kind: 'button', label: 'View the invoice and pay', url: input.url },
    { kind: 'small', text: 'You can pay by card on the page. The service record is on the same page.' },
  ]);
}

export function paymentReceivedMail(input: {
  business: Business;
  customerName: string;
  invoiceNumber: string;
  amount: string;
  paidOn: string;
  url: string;
}): RenderedMail {
  return layout(input.business, `Payment received for ${input.invoiceNumber}: thank you`, [
    { kind: 'p', text: greeting(input.customerName) },
    { kind: 'p', text: `Thank you: we received your payment of ${input.amount} for invoice ${input.invoiceNumber} on ${input.paidOn}.` },
    { kind: 'button', label: 'View your record and receipt', url: input.url },
  ]);
}

export function serviceReminderMail(input: {
  business: Business;
  customerName: string;
  vehicle: string;
  registration: string;
  dueBy: string;
  dueDistance: string | null;
  trigger: 'date' | 'distance';
}): RenderedMail {
  const when =
    input.trigger === 'distance' && input.dueDistance
      ? `At the distance you usually drive, it will reach ${input.dueDistance} around ${input.dueBy}.`
      : `It is due by ${input.dueBy}${input.dueDistance ? ` or at ${input.dueDistance}, whichever comes first` : ''}.`;
  const contact = [input.business.phone && `call ${input.business.phone}`, input.business.email && `reply to this e-mail`].filter(Boolean).join(' or ');
  return layout(input.business, `${input.registration} is due a service by ${input.dueBy}`, [
    { kind: 'p', text: greeting(input.customerName) },
    { kind: 'p', text: `Your ${input.vehicle} (${input.registration}) is coming up to its next service. ${when}` },
    { kind: 'p', text: `To book a visit, ${contact || 'get in touch'}. We come to you.` },
  ]);
}
