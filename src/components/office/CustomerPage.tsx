// One customer: their details, their vehicles, and every visit and finding on them.
import { useQuery } from '@tanstack/react-query';
import type { customerHistory } from '../../lib/server/customers';
import { linkButtonClass } from '../ui/Button';
import { SeverityBadge } from '../ui/SeverityBadge';
import { api, type Json } from './api';
import { CustomerForm } from './CustomerForm';
import { formatDocumentNumber } from '../../lib/billing/document-numbers';
import { formatMoney } from '../../lib/trade';
import { dayLabel, STATUS_LABEL } from './format';

const dateLabel = (instant: string) => new Date(instant).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });
import { island } from './query-client';
import { Panel } from './Panel';

type History = Json<Awaited<ReturnType<typeof customerHistory>>>;

function CustomerPage({ customerId }: { customerId: string }) {
  const history = useQuery({
    queryKey: ['customer-history', customerId],
    queryFn: () => api<History>(`/api/office/customers/${customerId}/history`),
  });
  if (history.isLoading) return <p>Loading…</p>;
  if (history.isError) return <p role="alert" className="font-bold text-sev-now">{(history.error as Error).message}</p>;
  const { customer, vehicles, visits, invoices } = history.data!;
  return (
    <div className="grid grid-cols-[minmax(0,3fr)_minmax(0,4fr)] gap-6">
      <Panel title="Details">
        <CustomerForm
          key={customer.updatedAt as unknown as string}
          customerId={customer.id}
          initial={{
            name: customer.name,
            email: customer.email ?? '',
            phone: customer.phone ?? '',
            addressLines: customer.addressLines,
            postcode: customer.postcode,
            notes: customer.notes,
          }}
          onSaved={() => undefined}
        />
      </Panel>
      <div className="flex flex-col gap-6">
        <Panel
          title={`Vehicles (${vehicles.length})`}
          actions={
            <a href={`/office/vehicles/new?customerId=${customer.id}`} className={linkButtonClass}>
              Add vehicle
            </a>
          }
        >
          {vehicles.length === 0 ? (
            <p>No vehicles yet.</p>
          ) : (
            <ul className="divide-y divide-ink/10">
              {vehicles.map((v) => (
                <li key={v.id} className="flex items-baseline gap-3 py-2">
                  <a href={`/office/vehicles/${v.id}`} className="font-mono font-bold text-brand underline">
                    {v.registration}
                  </a>
                  <span>
                    {v.make} {v.model} {v.engine} {v.year ?? ''}
                  </span>
                  <span className="ml-auto text-sm text-ink/70">
                    Last service: {v.lastServiceDate ? dayLabel(v.lastServiceDate, 'd MMM yyyy') : 'not known'}
                  </span>
                </li>
              ))}
            </ul>
          )}
        </Panel>
        <Panel title={`Visits (${visits.length})`}>
          {visits.length === 0 ? (
            <p>No visits yet.</p>
          ) : (
            <table className="w-full text-left text-[15px]">
              <thead>
                <tr className="border-b border-ink/20">
                  <th className="py-1 pr-3">Day</th>
                  <th className="py-1 pr-3">Vehicle</th>
                  <th className="py-1 pr-3">Checklist</th>
                  <th className="py-1 pr-3">Technician</th>
                  <th className="py-1 pr-3">Status</th>
                  <th className="py-1">Findings</th>
                </tr>
              </thead>
              <tbody>
                {visits.map((visit) => (
                    <tr key={visit.id} className="border-b border-ink/10 align-top">
                      <td className="py-1 pr-3 whitespace-nowrap">
                        <a href={`/office/visits/${visit.id}`} className="text-brand underline">
                          {dayLabel(visit.roundDate, 'd MMM yyyy')}
                        </a>
                      </td>
                      <td className="py-1 pr-3 font-mono">{visit.registration}</td>
                      <td className="py-1 pr-3">{visit.checklist}</td>
                      <td className="py-1 pr-3">{visit.technicianName}</td>
                      <td className="py-1 pr-3">{STATUS_LABEL[visit.status]}</td>
                      <td className="py-1">
                        {visit.findings.length === 0 ? (
                          '—'
                        ) : (
                          <ul>
                            {visit.findings.map((f) => (
                              <li key={f.id} className="flex items-center gap-2">
                                <SeverityBadge severity={f.severity} size={16} /> {f.title}
                              </li>
                            ))}
                          </ul>
                        )}
                      </td>
                    </tr>
                ))}
              </tbody>
            </table>
          )}
        </Panel>
        <Panel title={`Invoices (${invoices.length})`}>
          {invoices.length === 0 ? (
            <p>No invoices yet.</p>
          ) : (
            <table className="w-full text-left text-[15px]">
              <thead>
                <tr className="border-b border-ink/20">
                  <th className="py-1 pr-3">Invoice</th>
                  <th className="py-1 pr-3">Issued</th>
                  <th className="py-1 pr-3">Status</th>
                  <th className="py-1 text-right">Total</th>
                </tr>
              </thead>
              <tbody>
                {invoices.map((invoice) => (
                  <tr key={invoice.id} className="border-b border-ink/10">
                    <td className="py-1 pr-3">
                      <a href={`/office/invoices/${invoice.id}`} className="font-mono text-brand underline">
                        {invoice.number === null ? 'Draft' : formatDocumentNumber('invoice', invoice.number)}
                      </a>
                    </td>
                    <td className="py-1 pr-3">{invoice.issuedAt ? dateLabel(invoice.issuedAt) : '—'}</td>
                    <td className="py-1 pr-3">{invoice.status}</td>
                    <td className="py-1 text-right font-mono">{formatMoney(invoice.totalMinor, invoice.currency)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </Panel>
      </div>
    </div>
  );
}

export default island(CustomerPage);
