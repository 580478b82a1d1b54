import "server-only";
import { and, asc, eq, inArray } from "drizzle-orm";
import type { BalloonFamilyView, StentPlatformView, StockView } from "@/lib/stock/types";
import type { Database } from "../index";
import { balloonFamilies, balloons, stentPlatforms, stentSizes } from "../schema";
import type { Tx } from "./audit";

type Reader = Tx | Database;

export async function readFamilies(reader: Reader, labId: number, ids?: number[]): Promise<BalloonFamilyView[]> {
  if (ids && ids.length === 0) return [];
  const famWhere = ids
    ? and(eq(balloonFamilies.labId, labId), inArray(balloonFamilies.id, ids))
    : eq(balloonFamilies.labId, labId);
  const balWhere = ids ? and(eq(balloons.labId, labId), inArray(balloons.familyId, ids)) : eq(balloons.labId, labId);
  const [fams, bals] = await Promise.all([
    reader.select().from(balloonFamilies).where(famWhere).orderBy(asc(balloonFamilies.name), asc(balloonFamilies.id)),
    reader.select().from(balloons).where(balWhere).orderBy(asc(balloons.diameterMm)),
  ]);
  return fams.map((f) => ({
    id: f.id,
    name: f.name,
    compliance: f.compliance,
    nominalAtm: f.nominalAtm,
    rbpAtm: f.rbpAtm,
    growthAtRbpMm: f.growthAtRbpMm ?? null,
    balloons: bals
      .filter((b) => b.familyId === f.id)
      .map((b) => ({ id: b.id, diameterMm: b.diameterMm, inStock: b.inStock })),
  }));
}

export async function readPlatforms(reader: Reader, labId: number, ids?: number[]): Promise<StentPlatformView[]> {
  if (ids && ids.length === 0) return [];
  const platWhere = ids
    ? and(eq(stentPlatforms.labId, labId), inArray(stentPlatforms.id, ids))
    : eq(stentPlatforms.labId, labId);
  const sizeWhere = ids
    ? and(eq(stentSizes.labId, labId), inArray(stentSizes.platformId, ids))
    : eq(stentSizes.labId, labId);
  const [plats, sizes] = await Promise.all([
    reader.select().from(stentPlatforms).where(platWhere).orderBy(asc(stentPlatforms.name), asc(stentPlatforms.id)),
    reader.select().from(stentSizes).where(sizeWhere).orderBy(asc(stentSizes.nominalMm)),
  ]);
  return plats.map((p) => ({
    id: p.id,
    name: p.name,
    sizes: sizes
      .filter((s) => s.platformId === p.id)
      .map((s) => ({ id: s.id, nominalMm: s.nominalMm, maxPostDilatationMm: s.maxPostDilatationMm })),
  }));
}

/** Families and platforms as one value, read inside the caller's transaction. */
export async function readStock(reader: Reader, labId: number): Promise<Omit<StockView, "revision">> {
  return { balloonFamilies: await readFamilies(reader, labId), stentPlatforms: await readPlatforms(reader, labId) };
}
