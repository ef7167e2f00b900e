// The load list of a technician's round, and the parts the business's rounds need over a span
// of days (for the order list). The sums and container rounding are pure (lib/trade/load-list);
// this module reads the visits, specs, checklists and stock they work on.
import { and, asc, eq, gte, inArray, lte } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { checklistTemplates, customers, parts, templateItems, templateVersions, vehicles, visits } from '../../db/schema';
import { buildLoadList, type StockPart } from '../trade/load-list';
import { partsNeededForVisit } from '../trade/parts-needed';
import { sumQuantities } from '../trade/quantity';
import { stockLevels } from './van-stock';
import { containerSizesOf, stockPartColumns } from './catalogue';
import { usedOilHeld } from './used-oil';
import type { Van } from './van-access';
import type { RoundLoadList } from '../van/load-list-contract';

// Visits not yet started or under way still need their parts; done and cancelled ones do not.
const VISITS_TO_LOAD = ['booked', 'in_progress'] as const;

export type VisitScope = { organisationId: string; technicianId?: string; from: string; to: string };

async function plannedVisits(scope: VisitScope) {
  return getDb()
    .select({
      id: visits.id,
      technicianId: visits.technicianId,
      roundDate: visits.roundDate,
      roundPosition: visits.roundPosition,
      slotStart: visits.slotStart,
      postcode: visits.postcode,
      templateVersionId: visits.templateVersionId,
      checklist: checklistTemplates.name,
      customerName: customers.name,
      vehicle: {
        registration: vehicles.registration,
        make: vehicles.make,
        model: vehicles.model,
        engine: vehicles.engine,
        fuel: vehicles.fuel,
        oilGrade: vehicles.oilGrade,
        oilCapacityL: vehicles.oilCapacityL,
        oilFilterPartId: vehicles.oilFilterPartId,
        airFilterPartId: vehicles.airFilterPartId,
        cabinFilterPartId: vehicles.cabinFilterPartId,
        fuelFilterPartId: vehicles.fuelFilterPartId,
        sparkPlugPartId: vehicles.sparkPlugPartId,
        sparkPlugCount: vehicles.sparkPlugCount,
      },
    })
    .from(visits)
    .innerJoin(vehicles, eq(vehicles.id, visits.vehicleId))
    .innerJoin(customers, eq(customers.id, visits.customerId))
    .innerJoin(templateVersions, eq(templateVersions.id, visits.templateVersionId))
    .innerJoin(checklistTemplates, eq(checklistTemplates.id, templateVersions.templateId))
    .where(
      and(
        eq(visits.organisationId, scope.organisationId),
        scope.technicianId ? eq(visits.technicianId, scope.technicianId) : undefined,
        gte(visits.roundDate, scope.from),
        lte(visits.roundDate, scope.to),
        inArray(visits.status, [...VISITS_TO_LOAD]),
      ),
    )
    .orderBy(asc(visits.roundDate), asc(visits.technicianId), asc(visits.roundPosition), asc(visits.slotStart));
}

type PlannedVisit = Awaited<ReturnType<typeof plannedVisits>>[number];

/** Each visit's parts, worked out from its vehicle spec and its checklist's part items. */
async function needsOf(organisationId: string, planned: PlannedVisit[]) {
  const db = getDb();
  const versionIds = [...new Set(planned.map((v) => v.templateVersionId))];
  const items = versionIds.length
    ? await db
        .select({ id: templateItems.id, versionId: templateItems.versionId, label: templateItems.label, partKind: templateItems.partKind })
        .from(templateItems)
        .where(and(inArray(templateItems.versionId, versionIds), eq(templateItems.kind, 'part')))
        .orderBy(asc(templateItems.position))
    : [];
  const oils = await db
    .select({ id: parts.id, partNumber: parts.partNumber, oilGrade: parts.oilGrade })
    .from(parts)
    .where(and(eq(parts.organisationId, organisationId), eq(parts.kind, 'oil'), eq(parts.active, true)))
    .orderBy(asc(parts.partNumber));
  return planned.map((visit) => ({
    visit,
    ...partsNeededForVisit(visit.vehicle, items.filter((i) => i.versionId === visit.templateVersionId), oils),
  }));
}

async function catalogueFor(organisationId: string, partIds: string[]) {
  if (partIds.length === 0) return { parts: [] as StockPart[], containerSizes: new Map<string, number[]>(), rows: [] };
  const rows = await getDb()
    .select({ ...stockPartColumns, supplier: parts.supplier, costMinor: parts.costMinor })
    .from(parts)
    .where(and(eq(parts.organisationId, organisationId), inArray(parts.id, partIds)));
  const stockParts: StockPart[] = rows.map(({ supplier: _s, costMinor: _c, ...part }) => part);
  return { parts: stockParts, containerSizes: await containerSizesOf(organisationId, partIds), rows };
}

/**
 * The parts each planned visit in `scope` needs, and the catalogue rows they name. A need that
 * points at a part outside the business (a spec's dangling id) becomes a gap, as does a spec
 * that lacks what its vehicle's fuel needs.
 */
export async function needsInScope(scope: VisitScope) {
  const planned = await plannedVisits(scope);
  const withNeeds = await needsOf(scope.organisationId, planned);
  const catalogue = await catalogueFor(scope.organisationId, [...new Set(withNeeds.flatMap((v) => v.needs.map((n) => n.partId)))]);
  const known = new Set(catalogue.parts.map((p) => p.id));
  const gaps: string[] = [];
  const visitNeeds = withNeeds.map((v) => {
    gaps.push(...v.gaps);
    return v.needs.filter((n) => {
      if (known.has(n.partId)) return true;
      gaps.push(`${v.visit.vehicle.registration}: the spec points at a part that is not in the catalogue`);
      return false;
    });
  });
  return { planned, visitNeeds, catalogue, gaps };
}

// The answer's shape is the contract the phone checks (lib/van/load-list-contract.ts).
export type { RoundLoadList };

/** What the technician's van must carry for their round on `roundDate`. No money figures. */
export async function loadListForRound(van: Van, roundDate: string): Promise<RoundLoadList> {
  const { planned, visitNeeds, catalogue, gaps } = await needsInScope({
    organisationId: van.organisationId,
    technicianId: van.technicianId,
    from: roundDate,
    to: roundDate,
  });
  const partsById = new Map(catalogue.parts.map((p) => [p.id, p]));
  const list = buildLoadList({
    visitNeeds,
    parts: catalogue.parts,
    containerSizes: catalogue.containerSizes,
    onHand: await stockLevels(getDb(), van.organisationId, van.technicianId),
  });
  return {
    technician: { id: van.technicianId, name: van.technicianName },
    roundDate,
    visits: planned.map((visit, index) => ({
      id: visit.id,
      position: index + 1,
      slotStart: visit.slotStart.toISOString(),
      registration: visit.vehicle.registration,
      vehicle: `${visit.vehicle.make} ${visit.vehicle.model}${visit.vehicle.engine ? ` ${visit.vehicle.engine}` : ''}`,
      customerName: visit.customerName,
      postcode: visit.postcode,
      checklist: visit.checklist,
      parts: visitNeeds[index]!.map((n) => {
        const part = partsById.get(n.partId)!;
        return { partNumber: part.partNumber, description: part.description, quantity: n.quantity, unit: part.unit };
      }),
    })),
    ...list,
    gaps,
    usedOil: {
      heldL: await usedOilHeld(van),
      // About as much drains out as goes back in: the oil this round puts in.
      expectedL: sumQuantities(list.grades.map((g) => g.needed)),
    },
  };
}
