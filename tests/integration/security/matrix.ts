// The authorization matrix: one row per API route and method, saying what each kind of caller
// gets back. `authorization.test.ts` calls every row as every caller it names and fails when a
// route file or an exported method under src/pages/api has no row here.
//
// Callers (world.ts): anonymous; A's technician (whose visits these are); A's other technician;
// A's office and owner; and B's technician, office and owner calling with A's ids. A caller left
// out of a row is not called, and the row's comment says why.
//
// Adding a route: add a row with the route's file (relative to src/pages/api) and method, start
// from the preset that fits (OFFICE_ITEM for a path id, OFFICE_LIST for a list or a create, ...),
// and give the request a target in world.ts that the allowed call may change.
import { randomUUID } from 'node:crypto';
import { expect } from 'vitest';
import { TestDevice } from '../../support/sync-ops';
import { UNSENT_FILE_FORMAT, UNSENT_FILE_VERSION } from '../../../src/lib/sync/unsent-file';
import { roundVisitIds, WIPERS, type Caller, type World } from './world';

export const METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE', 'ALL'] as const;
export type Method = (typeof METHODS)[number];

/** A status, or the statuses any of which is right (a retry of an idempotent upload, say). */
export type Expected = number | readonly number[];
export type Probe = { path: string; method?: string; body?: unknown; headers?: Record<string, string> };
type Build = (w: World, caller: Caller) => Probe | Promise<Probe>;

export type Row = {
  file: string;
  method: Method;
  /** Why the route answers without a session; its own check (signature, token) is what the probes test. */
  public?: string;
  expect: Partial<Record<Caller, Expected>>;
  request: Build;
  /** Calls that must be refused whoever makes them (forged tokens, another record's ids). */
  probes?: { name: string; request: (w: World) => Probe; expect: Expected }[];
  /** More to assert about an answer the expected status let through. */
  check?: (w: World, caller: Caller, body: any) => void;
};

// ---- presets -----------------------------------------------------------------------------------

const SIGNED_IN_ONLY = { anonymous: 401 } as const;
// An office route naming one of A's records by id: A's technicians are refused by role (403),
// B's people by organisation (404, the same answer as for an id that names nothing).
const OFFICE_ITEM = { anonymous: 401, technician: 403, otherTechnician: 403, outsiderTechnician: 403, outsider: 404, outsiderOwner: 404 } as const;
// An office route without an id (a list, a create, a run): B's office gets B's own answer, which
// must hold nothing of A's (checked for every answer to B).
const OFFICE_LIST = { anonymous: 401, technician: 403, otherTechnician: 403, outsiderTechnician: 403, outsider: 200, outsiderOwner: 200 } as const;
// A route that takes A's ids in its body: B's office gets 422, the ids are not of B's business.
const OFFICE_REFERENCES = { ...OFFICE_LIST, outsider: 422, outsiderOwner: 422 } as const;
// People and business settings: the owner's alone (PRODUCT.md, roles).
const OWNER_ITEM = { ...OFFICE_ITEM, office: 403, outsider: 403 } as const;
const OWNER_LIST = { ...OFFICE_LIST, office: 403, outsider: 403 } as const;

// ---- request helpers ---------------------------------------------------------------------------

const get = (path: string): Probe => ({ path, method: 'GET' });
const post = (path: string, body: unknown = {}): Probe => ({ path, method: 'POST', body });
const put = (path: string, body: unknown): Probe => ({ path, method: 'PUT', body });
const del = (path: string): Probe => ({ path, method: 'DELETE', body: {} });

const unique = () => randomUUID().slice(0, 8);
const daysAhead = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

const customerBody = () => ({ name: `Matrix Keeper ${unique()}`, email: '', phone: '', addressLines: '9 Matrix Row', postcode: 'QX1 2MM', notes: '' });
const vehicleBody = (customerId: string, registration = `MX${unique().replace(/[^a-z0-9]/gi, '').slice(0, 5)}`.toUpperCase()) => ({
  customerId,
  registration,
  vin: '',
  make: 'Halden',
  model: 'Rook',
  engine: '1.6 diesel',
  fuel: 'diesel',
  year: '2021',
  odometerUnit: '[mi_i]',
  oilGrade: '',
  oilCapacityL: '',
  oilFilterPartId: '',
  airFilterPartId: '',
  cabinFilterPartId: '',
  fuelFilterPartId: '',
  sparkPlugPartId: '',
  sparkPlugCount: '',
  plugThread: '',
  plugSeat: '',
  plugGapMm: '',
  plugTorqueNm: '',
  sumpPlugTorqueNm: '',
  wheelNutTorqueNm: '',
  brakeFluidGrade: '',
  tyrePressureFrontKpa: '',
  tyrePressureRearKpa: '',
  specialTools: '',
  serviceIntervalMonths: '',
  serviceIntervalDistance: '',
  lastServiceDate: '',
  lastServiceOdometer: '',
});
const slot = (technicianId: string, roundDate: string) => ({ technicianId, roundDate, start: '10:00', end: '11:00', addressLines: '4 Mill Lane', postcode: 'ZZ1 1AA', accessNotes: '' });
const settingsBody = () => ({
  name: 'Matrix Servicing',
  addressLines: '1 Matrix Yard',
  phone: '',
  email: '',
  currency: 'GBP',
  labourRate: '60',
  taxPercent: '20',
  distanceUnit: '[mi_i]',
  timeZone: 'Europe/London',
  workdayStart: '08:00',
  workdayEnd: '18:00',
  reminderLeadDays: '14',
});

/** A check ticked on A's pushed-to visit, from a device of the caller's own. */
function checkOp(w: World, caller: Caller) {
  const device = new TestDevice(`matrix-${caller}`, Date.now());
  return post('/api/sync/push', { deviceId: `matrix-${caller}`, operations: [device.check(w.ids.pushVisitId, w.ids.setup.checklist.checks[0]!, 'done')] });
}

/** A file of one unsent tick, as A's technician's phone saves it (lib/sync/unsent-file.ts). */
function unsentFile(w: World, caller: Caller) {
  const deviceId = `matrix-file-${caller}`;
  const device = new TestDevice(deviceId, Date.now());
  const op = device.check(w.ids.pushVisitId, w.ids.setup.checklist.checks[1]!, 'done');
  const now = new Date().toISOString();
  return {
    format: UNSENT_FILE_FORMAT,
    version: UNSENT_FILE_VERSION,
    createdAt: now,
    user: { id: w.a.technician.id, name: w.a.technician.name, email: w.a.technician.email },
    deviceId,
    lastSyncedAt: null,
    operations: [{ state: 'pending', reason: null, createdAt: now, op }],
    photos: [],
  };
}

const outcomes = (body: { results?: { outcome: string }[] }) => (body.results ?? []).map((r) => r.outcome);

// ---- the matrix --------------------------------------------------------------------------------

export const MATRIX: Row[] = [
  // Public: better-auth's own routes (sign-in, sign-out, session) must answer before anyone has a
  // session; sign-in is rate limited and origin checked (tests/integration/auth, origin.test.ts).
  {
    file: 'auth/[...all].ts',
    method: 'ALL',
    public: 'sign-in, sign-out and session for better-auth; rate limited per client address',
    expect: { anonymous: 200 },
    request: () => get('/api/auth/get-session'),
    check: (_w, _c, body) => expect(body).toBeNull(),
  },
  {
    file: 'health.ts',
    method: 'GET',
    public: 'load balancers and the start script ask whether the app and PostgreSQL answer; it says nothing else',
    expect: { anonymous: 200 },
    request: () => get('/api/health'),
    check: (_w, _c, body) => expect(body).toEqual({ ok: true }),
  },
  {
    file: 'me.ts',
    method: 'GET',
    expect: { ...SIGNED_IN_ONLY, technician: 200, otherTechnician: 200, office: 200, owner: 200, outsiderTechnician: 200, outsider: 200, outsiderOwner: 200 },
    request: () => get('/api/me'),
    check: (w, caller, body) => expect(body.user.email).toBe(emailOf(w, caller)),
  },

  // Sync and photos: every signed-in person, each within their own business and rounds.
  {
    file: 'sync/pull.ts',
    method: 'GET',
    // Every caller gets 200 with what they may see; the other technician and B must get nothing of
    // A's technician's visits (checked on every 2xx answer to them).
    expect: { ...SIGNED_IN_ONLY, technician: 200, otherTechnician: 200, office: 200, owner: 200, outsiderTechnician: 200, outsider: 200, outsiderOwner: 200 },
    request: () => get('/api/sync/pull?cursor=0'),
    check: (w, caller, body) => {
      if (caller === 'technician') expect(JSON.stringify(body)).toContain(w.ids.pushVisitId);
    },
  },
  {
    file: 'sync/push.ts',
    method: 'POST',
    // The other technician's batch is refused whole (403); B's operations name a visit B does not
    // have, so each is `rejected` and nothing is stored (per-operation answers, lib/sync/README.md).
    expect: { ...SIGNED_IN_ONLY, technician: 200, otherTechnician: 403, office: 200, owner: 200, outsiderTechnician: 200, outsider: 200, outsiderOwner: 200 },
    request: checkOp,
    check: (_w, caller, body) => expect(outcomes(body)).toEqual([caller.startsWith('outsider') ? 'rejected' : 'applied']),
  },
  {
    file: 'photos/[sha256].ts',
    method: 'PUT',
    // Anyone signed in may upload; the bytes are kept under their own business, so B sending the
    // same bytes stores B's copy and touches nothing of A's. 200 once a copy exists in that business.
    expect: { ...SIGNED_IN_ONLY, technician: [200, 201], otherTechnician: 200, office: 200, owner: 200, outsiderTechnician: 201, outsider: 200, outsiderOwner: 200 },
    // Bytes of their own, so B's copy never stands in for A's photo in the rows below.
    request: (w) => ({ path: `/api/photos/${w.ids.uploadSha}`, method: 'PUT', body: w.ids.uploadBytes, headers: { 'content-type': 'image/png' } }),
  },
  {
    file: 'photos/[sha256].ts',
    method: 'GET',
    expect: { ...SIGNED_IN_ONLY, technician: 200, otherTechnician: 404, office: 200, owner: 200, outsiderTechnician: 404, outsider: 404, outsiderOwner: 404 },
    request: (w) => get(`/api/photos/${w.ids.photoSha}`),
  },
  {
    file: 'photos/[sha256]/thumbnail.ts',
    method: 'GET',
    expect: { ...SIGNED_IN_ONLY, technician: 200, otherTechnician: 404, office: 200, owner: 200, outsiderTechnician: 404, outsider: 404, outsiderOwner: 404 },
    request: (w) => get(`/api/photos/${w.ids.photoSha}/thumbnail`),
  },

  // Van stock. A technician reads their own van; the office and owner any van of the business,
  // named by technicianId. Asking for another technician's van is 403 for a technician (whoever's
  // it is) and 404 for B's office (no such technician in B).
  {
    file: 'van/stock.ts',
    method: 'GET',
    expect: { ...SIGNED_IN_ONLY, technician: 200, otherTechnician: 403, office: 200, owner: 200, outsiderTechnician: 403, outsider: 404, outsiderOwner: 404 },
    request: (w) => get(`/api/van/stock?technicianId=${w.a.technician.id}`),
  },
  {
    file: 'van/movements.ts',
    method: 'GET',
    expect: { ...SIGNED_IN_ONLY, technician: 200, otherTechnician: 403, office: 200, owner: 200, outsiderTechnician: 403, outsider: 404, outsiderOwner: 404 },
    request: (w) => get(`/api/van/movements?technicianId=${w.a.technician.id}`),
  },
  {
    file: 'van/load-list.ts',
    method: 'GET',
    expect: { ...SIGNED_IN_ONLY, technician: 200, otherTechnician: 403, office: 200, owner: 200, outsiderTechnician: 403, outsider: 404, outsiderOwner: 404 },
    request: (w) => get(`/api/van/load-list?technicianId=${w.a.technician.id}`),
  },

  // The customer's signed link: no account, the token is the authority.
  {
    file: 'public/record/[token]/advised/[id].ts',
    method: 'POST',
    public: "the customer's answer from the signed record link; the token names one visit of one business",
    expect: { anonymous: 200 },
    request: (w) => post(`/api/public/record/${w.ids.sentRecordToken}/advised/${w.ids.customerAdvisedId}`, { decision: 'approved' }),
    probes: [
      { name: 'a forged signature', request: (w) => post(`/api/public/record/${forge(w.ids.sentRecordToken)}/advised/${w.ids.customerAdvisedId}`, { decision: 'declined' }), expect: 404 },
      { name: 'advised work of another record', request: (w) => post(`/api/public/record/${w.ids.sentRecordToken}/advised/${w.ids.decidableAdvisedId}`, { decision: 'declined' }), expect: 404 },
    ],
  },
  {
    file: 'public/record/[token]/pay.ts',
    method: 'POST',
    public: "the customer's card payment from the signed record link; it opens a checkout for that record's invoice only",
    expect: { anonymous: 200 },
    request: (w) => post(`/api/public/record/${w.ids.sentRecordToken}/pay`),
    probes: [{ name: 'a forged signature', request: (w) => post(`/api/public/record/${forge(w.ids.sentRecordToken)}/pay`), expect: 404 }],
  },
  {
    file: 'public/payments/stripe-webhook.ts',
    method: 'POST',
    public: "Stripe's calls; only an event signed with the webhook secret is read (tests/integration/follow-up/payments)",
    expect: { anonymous: 400 },
    request: () => ({ path: '/api/public/payments/stripe-webhook', method: 'POST', body: '{"id":"evt_forged","type":"checkout.session.completed"}', headers: { 'content-type': 'application/json' } }),
    probes: [
      {
        name: 'a made-up signature',
        request: () => ({
          path: '/api/public/payments/stripe-webhook',
          method: 'POST',
          body: '{"id":"evt_forged","type":"checkout.session.completed"}',
          headers: { 'content-type': 'application/json', 'stripe-signature': `t=${Math.floor(Date.now() / 1000)},v1=${'0'.repeat(64)}` },
        }),
        expect: 400,
      },
    ],
  },

  // Office console: office and owner of the business.
  { file: 'office/advised-work/index.ts', method: 'GET', expect: { ...OFFICE_LIST, office: 200, owner: 200 }, request: () => get('/api/office/advised-work') },
  {
    file: 'office/advised-work/[id]/book.ts',
    method: 'POST',
    expect: { ...OFFICE_ITEM, office: 201 },
    request: (w) => post(`/api/office/advised-work/${w.ids.bookableAdvisedId}/book`, { technicianId: w.a.technician.id, date: daysAhead(50), start: '10:00', durationMinutes: 60 }),
  },
  {
    file: 'office/advised-work/[id]/decision.ts',
    method: 'POST',
    expect: { ...OFFICE_ITEM, office: 200 },
    request: (w) => post(`/api/office/advised-work/${w.ids.decidableAdvisedId}/decision`, { decision: 'approved' }),
  },
  { file: 'office/conflicts/index.ts', method: 'GET', expect: { ...OFFICE_LIST, office: 200, owner: 200 }, request: () => get('/api/office/conflicts?status=all') },
  {
    file: 'office/conflicts/[id]/resolve.ts',
    method: 'POST',
    expect: { ...OFFICE_ITEM, office: 200 },
    request: (w) => post(`/api/office/conflicts/${w.ids.conflictId}/resolve`, { use: 'standing' }),
  },
  { file: 'office/customers/index.ts', method: 'GET', expect: { ...OFFICE_LIST, office: 200, owner: 200 }, request: () => get('/api/office/customers') },
  // B's office creates a customer of B's own: allowed, and nothing of A's changes.
  { file: 'office/customers/index.ts', method: 'POST', expect: { ...OFFICE_LIST, outsider: 201, outsiderOwner: 201, office: 201, owner: 201 }, request: () => post('/api/office/customers', customerBody()) },
  { file: 'office/customers/[id].ts', method: 'GET', expect: { ...OFFICE_ITEM, office: 200, owner: 200 }, request: (w) => get(`/api/office/customers/${w.ids.setup.customerId}`) },
  { file: 'office/customers/[id].ts', method: 'PUT', expect: { ...OFFICE_ITEM, office: 200 }, request: (w) => put(`/api/office/customers/${w.ids.setup.customerId}`, { ...customerBody(), name: w.names.customer }) },
  { file: 'office/customers/[id]/history.ts', method: 'GET', expect: { ...OFFICE_ITEM, office: 200, owner: 200 }, request: (w) => get(`/api/office/customers/${w.ids.reviewed.customerId}/history`) },
  { file: 'office/dashboard.ts', method: 'GET', expect: { ...OFFICE_LIST, office: 200, owner: 200 }, request: () => get('/api/office/dashboard') },
  {
    file: 'office/findings/[id]/advised.ts',
    method: 'PUT',
    expect: { ...OFFICE_ITEM, office: 200 },
    request: (w) => put(`/api/office/findings/${w.ids.reviewed.findingIds.soon}/advised`, { description: 'Coolant change', priceMinor: 7500, labourCentiHours: 50 }),
  },
  { file: 'office/invoices/index.ts', method: 'GET', expect: { ...OFFICE_LIST, office: 200, owner: 200 }, request: () => get('/api/office/invoices') },
  { file: 'office/invoices/[id]/index.ts', method: 'GET', expect: { ...OFFICE_ITEM, office: 200, owner: 200 }, request: (w) => get(`/api/office/invoices/${w.ids.draftInvoiceId}`) },
  {
    file: 'office/invoices/[id]/index.ts',
    method: 'PUT',
    expect: { ...OFFICE_ITEM, office: 200 },
    request: (w) =>
      put(`/api/office/invoices/${w.ids.draftInvoiceId}`, {
        lines: [{ kind: 'labour', description: 'Labour: annual service', partNumber: null, quantity: 1.5, unit: 'h', unitPriceMinor: 6000, discountMinor: 0 }],
      }),
  },
  { file: 'office/invoices/[id]/index.ts', method: 'DELETE', expect: { ...OFFICE_ITEM, office: 200 }, request: (w) => del(`/api/office/invoices/${w.ids.discardableInvoiceId}`) },
  { file: 'office/invoices/[id]/send.ts', method: 'POST', expect: { ...OFFICE_ITEM, office: 200 }, request: (w) => post(`/api/office/invoices/${w.ids.sendableInvoiceId}/send`) },
  { file: 'office/invoices/[id]/credit.ts', method: 'POST', expect: { ...OFFICE_ITEM, office: 201 }, request: (w) => post(`/api/office/invoices/${w.ids.sentInvoiceId}/credit`, { reason: 'Charged twice' }) },
  { file: 'office/messages/index.ts', method: 'GET', expect: { ...OFFICE_LIST, office: 200, owner: 200 }, request: () => get('/api/office/messages') },
  { file: 'office/messages/[id]/index.ts', method: 'GET', expect: { ...OFFICE_ITEM, office: 200, owner: 200 }, request: (w) => get(`/api/office/messages/${w.ids.failedMessageId}`) },
  { file: 'office/messages/[id]/resend.ts', method: 'POST', expect: { ...OFFICE_ITEM, office: 202 }, request: (w) => post(`/api/office/messages/${w.ids.failedMessageId}/resend`) },
  { file: 'office/model-notes/index.ts', method: 'GET', expect: { ...OFFICE_LIST, office: 200, owner: 200 }, request: () => get('/api/office/model-notes') },
  {
    file: 'office/model-notes/index.ts',
    method: 'POST',
    expect: { ...OFFICE_LIST, outsider: 201, outsiderOwner: 201, office: 201, owner: 201 },
    request: () => post('/api/office/model-notes', { make: 'Halden', model: 'Rook', engine: '', title: `Matrix ${unique()}`, body: 'Check the intercooler hose clips.' }),
  },
  {
    file: 'office/model-notes/[id].ts',
    method: 'PUT',
    expect: { ...OFFICE_ITEM, office: 200 },
    request: (w) => put(`/api/office/model-notes/${w.ids.modelNoteId}`, { make: 'Corvane', model: 'Estrel', engine: '', title: 'Matrix note', body: 'Look at the coolant pipe clips.' }),
  },
  { file: 'office/order-list.ts', method: 'GET', expect: { ...OFFICE_LIST, office: 200, owner: 200 }, request: () => get('/api/office/order-list') },
  { file: 'office/parts/index.ts', method: 'GET', expect: { ...OFFICE_LIST, office: 200, owner: 200 }, request: () => get('/api/office/parts') },
  {
    file: 'office/parts/index.ts',
    method: 'POST',
    expect: { ...OFFICE_LIST, outsider: 201, outsiderOwner: 201, office: 201, owner: 201 },
    request: () => post('/api/office/parts', { partNumber: `MX-${unique()}`, description: 'Cabin filter', kind: 'cabin_filter', unit: '{each}', costMinor: 600, priceMinor: 1400 }),
  },
  { file: 'office/parts/[id]/index.ts', method: 'PATCH', expect: { ...OFFICE_ITEM, office: 200 }, request: (w) => ({ path: `/api/office/parts/${w.ids.filterPartId}`, method: 'PATCH', body: { priceMinor: 1250 } }) },
  { file: 'office/parts/[id]/containers.ts', method: 'PUT', expect: { ...OFFICE_ITEM, office: 200 }, request: (w) => put(`/api/office/parts/${w.ids.oilPartId}/containers`, { sizesL: [1, 5] }) },
  // The van routes below name A's technician in the body: B's office gets 404 (no such technician in B).
  {
    file: 'office/van-stock/movements.ts',
    method: 'POST',
    expect: { ...OFFICE_ITEM, office: 201 },
    request: (w) => post('/api/office/van-stock/movements', { technicianId: w.a.technician.id, reason: 'restock', lines: [{ partId: w.ids.oilPartId, quantity: 5 }], note: '' }),
  },
  {
    file: 'office/van-stock/count.ts',
    method: 'POST',
    expect: { ...OFFICE_ITEM, office: 200 },
    request: (w) => post('/api/office/van-stock/count', { technicianId: w.a.technician.id, partId: w.ids.oilPartId, counted: 4, note: 'Counted on the van' }),
  },
  {
    file: 'office/van-stock/minimums.ts',
    method: 'PUT',
    expect: { ...OFFICE_ITEM, office: 200 },
    request: (w) => put('/api/office/van-stock/minimums', { technicianId: w.a.technician.id, partId: w.ids.filterPartId, minimum: 2 }),
  },
  { file: 'office/used-oil.ts', method: 'GET', expect: { ...OFFICE_LIST, office: 200, owner: 200 }, request: () => get('/api/office/used-oil') },
  {
    file: 'office/used-oil/disposals.ts',
    method: 'POST',
    expect: { ...OFFICE_ITEM, office: 201 },
    request: (w) =>
      post('/api/office/used-oil/disposals', { technicianId: w.a.technician.id, disposedAt: new Date(Date.now() - 3_600_000).toISOString(), siteName: 'Aldersby oil bank', siteLicence: '', reference: '', litres: 5 }),
  },
  {
    // A technician's saved file of unsent changes, pushed as that technician. B's office naming A's
    // technician gets 404; the file's photos and operations go through the sync's own checks.
    file: 'office/unsent-changes.ts',
    method: 'POST',
    expect: { ...OFFICE_ITEM, office: 200 },
    request: (w, caller) => post('/api/office/unsent-changes', unsentFile(w, caller)),
    check: (_w, _caller, body) => expect(body.outcomes).toEqual({ applied: 1 }),
  },
  { file: 'office/people/index.ts', method: 'GET', expect: { ...OWNER_LIST, owner: 200 }, request: () => get('/api/office/people') },
  {
    file: 'office/people/index.ts',
    method: 'POST',
    // B's owner adds a person to B: allowed. A's office may not add anyone (owner only).
    expect: { ...OWNER_LIST, outsiderOwner: 201, owner: 201 },
    request: () => post('/api/office/people', { name: 'Matrix Fitter', email: `fitter.${unique()}@test.example`, role: 'technician', password: 'long-enough-password' }),
  },
  { file: 'office/people/[id].ts', method: 'PUT', expect: { ...OWNER_ITEM, owner: 200 }, request: (w) => put(`/api/office/people/${w.a.otherTechnician.id}`, { role: 'technician' }) },
  { file: 'office/reminders/run.ts', method: 'POST', expect: { ...OFFICE_LIST, office: 200 }, request: () => post('/api/office/reminders/run') },
  { file: 'office/rounds/index.ts', method: 'GET', expect: { ...OFFICE_LIST, office: 200, owner: 200 }, request: () => get('/api/office/rounds') },
  {
    file: 'office/rounds/order.ts',
    method: 'PUT',
    expect: { ...OFFICE_REFERENCES, office: 200 },
    request: async (w) =>
      put('/api/office/rounds/order', { technicianId: w.a.technician.id, roundDate: w.ids.orderDate, visitIds: await roundVisitIds(w.a.organisationId, w.a.technician.id, w.ids.orderDate) }),
  },
  // The office reads the business's hours and time zone to plan; only the owner changes them.
  { file: 'office/settings.ts', method: 'GET', expect: { ...OFFICE_LIST, office: 200, owner: 200 }, request: () => get('/api/office/settings') },
  { file: 'office/settings.ts', method: 'PUT', expect: { ...OWNER_LIST, outsiderOwner: 200, owner: 200 }, request: () => put('/api/office/settings', settingsBody()) },
  { file: 'office/spec-parts.ts', method: 'GET', expect: { ...OFFICE_LIST, office: 200, owner: 200 }, request: () => get('/api/office/spec-parts') },
  { file: 'office/team.ts', method: 'GET', expect: { ...OFFICE_LIST, office: 200, owner: 200 }, request: () => get('/api/office/team') },
  { file: 'office/template-versions/[id].ts', method: 'GET', expect: { ...OFFICE_ITEM, office: 200, owner: 200 }, request: (w) => get(`/api/office/template-versions/${w.ids.publishedVersionId}`) },
  {
    file: 'office/template-versions/[id].ts',
    method: 'PUT',
    expect: { ...OFFICE_ITEM, office: 200 },
    request: (w) => put(`/api/office/template-versions/${w.ids.savable.draftVersionId}`, { sections: [{ title: 'Outside', items: [WIPERS] }] }),
  },
  { file: 'office/template-versions/[id].ts', method: 'DELETE', expect: { ...OFFICE_ITEM, office: 200 }, request: (w) => del(`/api/office/template-versions/${w.ids.discardable.draftVersionId}`) },
  { file: 'office/template-versions/[id]/publish.ts', method: 'POST', expect: { ...OFFICE_ITEM, office: 200 }, request: (w) => post(`/api/office/template-versions/${w.ids.publishable.draftVersionId}/publish`) },
  { file: 'office/templates/index.ts', method: 'GET', expect: { ...OFFICE_LIST, office: 200, owner: 200 }, request: () => get('/api/office/templates') },
  {
    file: 'office/templates/index.ts',
    method: 'POST',
    expect: { ...OFFICE_LIST, outsider: 201, outsiderOwner: 201, office: 201, owner: 201 },
    request: () => post('/api/office/templates', { name: `Matrix checklist ${unique()}`, description: '', labourHours: '1', sections: [] }),
  },
  { file: 'office/templates/[id].ts', method: 'GET', expect: { ...OFFICE_ITEM, office: 200, owner: 200 }, request: (w) => get(`/api/office/templates/${w.ids.templateId}`) },
  {
    file: 'office/templates/[id].ts',
    method: 'PUT',
    expect: { ...OFFICE_ITEM, office: 200 },
    request: (w) => put(`/api/office/templates/${w.ids.templateId}`, { name: `Annual service ${unique()}`, description: 'Renamed', labourHours: '2' }),
  },
  { file: 'office/templates/[id]/draft.ts', method: 'POST', expect: { ...OFFICE_ITEM, office: 201 }, request: (w) => post(`/api/office/templates/${w.ids.templateId}/draft`) },
  { file: 'office/vehicles/index.ts', method: 'GET', expect: { ...OFFICE_LIST, office: 200, owner: 200 }, request: () => get('/api/office/vehicles') },
  { file: 'office/vehicles/index.ts', method: 'POST', expect: { ...OFFICE_REFERENCES, office: 201, owner: 201 }, request: (w) => post('/api/office/vehicles', vehicleBody(w.ids.setup.customerId)) },
  { file: 'office/vehicles/[id].ts', method: 'GET', expect: { ...OFFICE_ITEM, office: 200, owner: 200 }, request: (w) => get(`/api/office/vehicles/${w.ids.setup.vehicleId}`) },
  {
    file: 'office/vehicles/[id].ts',
    method: 'PUT',
    expect: { ...OFFICE_ITEM, office: 200 },
    request: (w) => put(`/api/office/vehicles/${w.ids.setup.vehicleId}`, vehicleBody(w.ids.setup.customerId, w.names.registration)),
  },
  { file: 'office/visits/index.ts', method: 'GET', expect: { ...OFFICE_LIST, office: 200, owner: 200 }, request: () => get('/api/office/visits') },
  {
    file: 'office/visits/index.ts',
    method: 'POST',
    expect: { ...OFFICE_REFERENCES, office: 201 },
    request: (w) => post('/api/office/visits', { customerId: w.ids.setup.customerId, vehicleId: w.ids.setup.vehicleId, templateId: w.ids.templateId, ...slot(w.a.technician.id, daysAhead(60)) }),
  },
  { file: 'office/visits/[id].ts', method: 'GET', expect: { ...OFFICE_ITEM, office: 200, owner: 200 }, request: (w) => get(`/api/office/visits/${w.ids.reviewed.visitId}`) },
  { file: 'office/visits/[id].ts', method: 'PUT', expect: { ...OFFICE_ITEM, office: 200 }, request: (w) => put(`/api/office/visits/${w.ids.moveVisitId}`, slot(w.a.technician.id, daysAhead(61))) },
  { file: 'office/visits/[id]/cancel.ts', method: 'POST', expect: { ...OFFICE_ITEM, office: 200 }, request: (w) => post(`/api/office/visits/${w.ids.cancelVisitId}/cancel`) },
  { file: 'office/visits/[id]/invoice.ts', method: 'POST', expect: { ...OFFICE_ITEM, office: 201 }, request: (w) => post(`/api/office/visits/${w.ids.reviewed.visitId}/invoice`) },
  // `again`: the world's failed message already counts as a first send of this record.
  { file: 'office/visits/[id]/record/send.ts', method: 'POST', expect: { ...OFFICE_ITEM, office: 202 }, request: (w) => post(`/api/office/visits/${w.ids.reviewed.visitId}/record/send`, { again: true }) },
  { file: 'office/visits/[id]/record/withdraw.ts', method: 'POST', expect: { ...OFFICE_ITEM, office: 200 }, request: (w) => post(`/api/office/visits/${w.ids.withSendable.visitId}/record/withdraw`) },
  { file: 'office/visits/[id]/review.ts', method: 'POST', expect: { ...OFFICE_ITEM, office: 200 }, request: (w) => post(`/api/office/visits/${w.ids.reviewed.visitId}/review`) },
];

/** The token with one character of its signature changed. */
function forge(token: string): string {
  const last = token.at(-1) === 'A' ? 'B' : 'A';
  return token.slice(0, -1) + last;
}

function emailOf(w: World, caller: Caller): string {
  const people = {
    technician: w.a.technician,
    otherTechnician: w.a.otherTechnician,
    office: w.a.office,
    owner: w.a.owner,
    outsiderTechnician: w.b.technician,
    outsider: w.b.office,
    outsiderOwner: w.b.owner,
  } as const;
  return people[caller as keyof typeof people].email;
}
