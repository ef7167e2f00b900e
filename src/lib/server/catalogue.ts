// The business's parts and consumables, with the container sizes each oil is stocked in.
import { and, asc, eq, inArray } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { nextChangeSeq, oilContainers, parts, type PartKind, type PART_UNITS } from '../../db/schema';
import { roundQuantity } from '../trade/quantity';
import { parseOilGrade } from '../trade/oil';
import { HttpError } from './http';
import { isUniqueViolation } from './db-errors';

export type CataloguePart = {
  id: string;
  partNumber: string;
  description: string;
  kind: string;
  unit: string;
  oilGrade: string | null;
  costMinor: number;
  priceMinor: number;
  supplier: string;
  active: boolean;
  containerSizesL: number[];
};

/** What the van screens show of a part (no money: technicians read these too). */
export const stockPartColumns = {
  id: parts.id,
  partNumber: parts.partNumber,
  description: parts.description,
  kind: parts.kind,
  unit: parts.unit,
  oilGrade: parts.oilGrade,
};

/** Each oil's container sizes, smallest first, for all the business's oils or the ones named. */
export async function containerSizesOf(organisationId: string, partIds?: string[]): Promise<Map<string, number[]>> {
  const rows = await getDb()
    .select({ partId: oilContainers.partId, sizeL: oilContainers.sizeL })
    .from(oilContainers)
    .where(and(eq(oilContainers.organisationId, organisationId), partIds ? inArray(oilContainers.partId, partIds) : undefined))
    .orderBy(asc(oilContainers.sizeL));
  const sizes = new Map<string, number[]>();
  for (const r of rows) sizes.set(r.partId, [...(sizes.get(r.partId) ?? []), r.sizeL]);
  return sizes;
}

export async function catalogueOf(organisationId: string, options: { activeOnly?: boolean } = {}): Promise<CataloguePart[]> {
  const rows = await getDb()
    .select({ ...stockPartColumns, costMinor: parts.costMinor, priceMinor: parts.priceMinor, supplier: parts.supplier, active: parts.active })
    .from(parts)
    .where(and(eq(parts.organisationId, organisationId), options.activeOnly ? eq(parts.active, true) : undefined))
    .orderBy(asc(parts.kind), asc(parts.partNumber));
  const sizes = await containerSizesOf(organisationId);
  return rows.map((r) => ({ ...r, containerSizesL: sizes.get(r.id) ?? [] }));
}

export type PartInput = {
  partNumber: string;
  description: string;
  kind: PartKind;
  unit: (typeof PART_UNITS)[number];
  oilGrade: string | null;
  costMinor: number;
  priceMinor: number;
  supplier: string;
  active: boolean;
};

/** Oil is bought and poured by the litre and named by its grade; nothing else has a grade. */
function checkPartRules(part: Pick<PartInput, 'kind' | 'unit' | 'oilGrade'>): string | null {
  if (part.kind !== 'oil') return null;
  if (part.unit !== 'L') throw new HttpError(422, 'Oil is stocked by the litre: set the unit to L.');
  if (!part.oilGrade) throw new HttpError(422, 'Give the oil’s SAE grade, e.g. 5W-30.');
  try {
    return parseOilGrade(part.oilGrade).grade;
  } catch (error) {
    throw new HttpError(422, (error as Error).message);
  }
}

export async function createPart(organisationId: string, input: PartInput) {
  const oilGrade = checkPartRules(input);
  try {
    const [row] = await getDb()
      .insert(parts)
      .values({ ...input, organisationId, oilGrade: input.kind === 'oil' ? oilGrade : null })
      .returning({ id: parts.id });
    return row!;
  } catch (error) {
    if (isUniqueViolation(error, 'parts_org_part_number_unique')) throw new HttpError(409, `Part number ${input.partNumber} is already in the catalogue.`);
    throw error;
  }
}

export async function updatePart(organisationId: string, partId: string, change: Partial<PartInput>) {
  const db = getDb();
  const [current] = await db.select().from(parts).where(and(eq(parts.id, partId), eq(parts.organisationId, organisationId)));
  if (!current) throw new HttpError(404, 'No such part in your catalogue.');
  const next = { ...current, ...change };
  const oilGrade = checkPartRules(next);
  try {
    await db
      .update(parts)
      .set({ ...change, oilGrade: next.kind === 'oil' ? oilGrade : null, updatedAt: new Date(), changeSeq: nextChangeSeq })
      .where(and(eq(parts.id, partId), eq(parts.organisationId, organisationId)));
  } catch (error) {
    if (isUniqueViolation(error, 'parts_org_part_number_unique')) throw new HttpError(409, `Part number ${change.partNumber} is already in the catalogue.`);
    throw error;
  }
}

/** Replaces the container sizes an oil is stocked in. */
export async function setContainerSizes(organisationId: string, partId: string, sizesL: number[]) {
  return getDb().transaction(async (tx) => {
    const [part] = await tx.select({ kind: parts.kind }).from(parts).where(and(eq(parts.id, partId), eq(parts.organisationId, organisationId)));
    if (!part) throw new HttpError(404, 'No such part in your catalogue.');
    if (part.kind !== 'oil') throw new HttpError(422, 'Container sizes are for oils; other parts are counted one by one.');
    await tx.delete(oilContainers).where(eq(oilContainers.partId, partId));
    const unique = [...new Set(sizesL.map(roundQuantity))];
    if (unique.length > 0) await tx.insert(oilContainers).values(unique.map((sizeL) => ({ organisationId, partId, sizeL })));
    return unique.sort((a, b) => a - b);
  });
}
