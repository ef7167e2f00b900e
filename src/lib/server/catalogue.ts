// The business's parts and consumables, with the container sizes each oil is stocked in.
import { and, asc, eq } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { oilContainers, parts } from '../../db/schema';

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

export async function catalogueOf(organisationId: string, options: { activeOnly?: boolean } = {}): Promise<CataloguePart[]> {
  const db = getDb();
  const rows = await db
    .select({
      id: parts.id,
      partNumber: parts.partNumber,
      description: parts.description,
      kind: parts.kind,
      unit: parts.unit,
      oilGrade: parts.oilGrade,
      costMinor: parts.costMinor,
      priceMinor: parts.priceMinor,
      supplier: parts.supplier,
      active: parts.active,
    })
    .from(parts)
    .where(and(eq(parts.organisationId, organisationId), options.activeOnly ? eq(parts.active, true) : undefined))
    .orderBy(asc(parts.kind), asc(parts.partNumber));
  const sizes = await db
    .select({ partId: oilContainers.partId, sizeL: oilContainers.sizeL })
    .from(oilContainers)
    .where(eq(oilContainers.organisationId, organisationId))
    .orderBy(asc(oilContainers.sizeL));
  return rows.map((r) => ({ ...r, containerSizesL: sizes.filter((s) => s.partId === r.id).map((s) => s.sizeL) }));
}
