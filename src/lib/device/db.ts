// The phone's own database (IndexedDB through Dexie): the round as last pulled, everything the
// technician recorded, and the outbox of operations the server has not acknowledged yet.
// One database per signed-in user, so a shared phone never mixes two technicians' outboxes.
//
// Schema versions only ever go up. To change a table: add `this.version(N + 1).stores({...})`
// with the changed tables only, and an `.upgrade(tx => ...)` if existing rows need rewriting.
// Never edit a released version's stores. See DEVELOPERS.md, "Phone: device store".
import Dexie, { type EntityTable, type Table } from 'dexie';
import type { PullResponse, PulledTemplateVersion, PulledVehicle, PulledVisit } from '../sync/pull';
import type { Hlc, Stamp } from '../sync/clock';
import type { Operation, OperationKind, Severity } from '../sync/operations';
import type { RoundLoadList } from '../van/load-list-contract';

export type CheckState = 'done' | 'skipped' | 'not_yet';

/** A visit as pulled; `gone` marks one the server took off this round while changes to it were unsent. */
export type LocalVisit = PulledVisit & { gone?: boolean };
export type LocalCustomer = PullResponse['customers'][number];
export type LocalVehicle = PulledVehicle;
export type LocalPart = PullResponse['parts'][number];
export type LocalModelNote = PullResponse['modelNotes'][number];
export type LocalTemplateVersion = PulledTemplateVersion;

// Each recorded thing keeps the stamp of the value it holds (ours or the server's): the next
// change sends it as `seenStamp`, so the server can tell a later edit from a concurrent one.
export type LocalCheckResult = { visitId: string; itemId: string; state: CheckState; stamp: Stamp };
export type LocalReadingResult = {
  visitId: string;
  itemId: string;
  value: number | null;
  textValue: string | null;
  unit: string | null;
  stamp: Stamp;
};
export type LocalFinding = {
  id: string;
  visitId: string;
  itemId: string | null;
  title: string;
  detail: string;
  severity: Severity;
  stamp: Stamp;
};
export type LocalNote = { id: string; visitId: string; body: string; stamp: Stamp };
export type LocalPhoto = {
  id: string;
  visitId: string;
  findingId: string | null;
  itemId: string | null;
  caption: string;
  sha256: string;
  contentType: string;
  sizeBytes: number;
  width: number | null;
  height: number | null;
  /** Where the bytes are: in `photoBlobs` on this phone, and/or on the server. */
  uploaded: boolean;
  /** A photo taken on another device (or whose local bytes were let go): the server's URL. */
  remoteUrl: string | null;
  removed: boolean;
  stamp: Stamp;
  takenAt: string;
};
export type LocalPhotoBlob = { sha256: string; blob: Blob };
export type LocalPartLine = {
  id: string;
  visitId: string;
  itemId: string | null;
  partId: string | null;
  partNumber: string;
  description: string;
  quantity: number;
  unit: string;
  removed: boolean;
  stamp: Stamp;
};
export type LocalSignOff = {
  id: string;
  visitId: string;
  odometer: number;
  odometerUnit: 'km' | '[mi_i]';
  customerName: string;
  signatureSvg: string;
  declaration: string;
  signedAt: string;
  stamp: Stamp;
};

/**
 * One operation waiting for the server. `rejected` ones stay (never silently dropped) and are
 * shown to the technician with the server's reason; they are not sent again.
 */
export type OutboxEntry = {
  seq?: number;
  opId: string;
  visitId: string;
  kind: OperationKind;
  entityId: string;
  op: Operation;
  state: 'pending' | 'rejected';
  attempts: number;
  reason: string | null;
  createdAt: string;
};

/** The load list of one round as the server last sent it, kept so it reads with no signal. */
export type LocalLoadList = { roundDate: string; list: RoundLoadList; fetchedAt: string };

export type MetaRow =
  | { key: 'clock'; value: Hlc }
  | { key: 'cursor'; value: string }
  | { key: 'lastSyncedAt'; value: string }
  | { key: 'lastSyncError'; value: string | null };

/** The first released schema; kept as it was so an upgrade test can open a phone at version 1. */
export const SCHEMA_V1 = {
  visits: 'id, roundDate',
  customers: 'id',
  vehicles: 'id',
  parts: 'id, kind',
  modelNotes: 'id, [make+model]',
  templateVersions: 'id',
  checkResults: '[visitId+itemId], visitId',
  readingResults: '[visitId+itemId], visitId',
  findings: 'id, visitId',
  notes: 'id, visitId',
  photos: 'id, visitId, sha256',
  photoBlobs: 'sha256',
  partLines: 'id, visitId',
  signOffs: 'visitId',
  outbox: '++seq, &opId, visitId, kind, state, [visitId+kind+entityId]',
  meta: 'key',
};

export class DeviceDb extends Dexie {
  visits!: EntityTable<LocalVisit, 'id'>;
  customers!: EntityTable<LocalCustomer, 'id'>;
  vehicles!: EntityTable<LocalVehicle, 'id'>;
  parts!: EntityTable<LocalPart, 'id'>;
  modelNotes!: EntityTable<LocalModelNote, 'id'>;
  templateVersions!: EntityTable<LocalTemplateVersion, 'id'>;
  checkResults!: Table<LocalCheckResult, [string, string]>;
  readingResults!: Table<LocalReadingResult, [string, string]>;
  findings!: EntityTable<LocalFinding, 'id'>;
  notes!: EntityTable<LocalNote, 'id'>;
  photos!: EntityTable<LocalPhoto, 'id'>;
  photoBlobs!: EntityTable<LocalPhotoBlob, 'sha256'>;
  partLines!: EntityTable<LocalPartLine, 'id'>;
  signOffs!: EntityTable<LocalSignOff, 'visitId'>;
  outbox!: EntityTable<OutboxEntry, 'seq'>;
  meta!: Table<MetaRow, string>;
  loadLists!: EntityTable<LocalLoadList, 'roundDate'>;

  constructor(name: string, options?: ConstructorParameters<typeof Dexie>[1]) {
    super(name, options);
    this.version(1).stores(SCHEMA_V1);
    // Version 2: the van's load list per round date, as the server computed it (sums, containers
    // and the van's stock are the server's; the phone only shows them). New table, no upgrade.
    this.version(2).stores({ loadLists: 'roundDate' });
  }
}

/** The database of one signed-in user on this phone. */
export function deviceDbName(userId: string): string {
  return `tickover-${userId}`;
}

/** The tables an action touches when it records a change: state, outbox and clock together. */
export function recordingTables(db: DeviceDb) {
  return [
    db.visits,
    db.checkResults,
    db.readingResults,
    db.findings,
    db.notes,
    db.photos,
    db.photoBlobs,
    db.partLines,
    db.signOffs,
    db.outbox,
    db.meta,
  ];
}
