// The query-level writes, each run through the operations layer's one write path (lab row
// locked, change, lab pass, audit row, then mail), for tests that set up or exercise data below
// the authorisation step. Tests of who may do what call lib/ops with a caller instead.
import { db } from "@/db";
import type { Tx } from "@/db/queries/audit";
import * as charts from "@/db/queries/charts";
import * as editions from "@/db/queries/editions";
import * as invitations from "@/db/queries/invitations";
import * as members from "@/db/queries/members";
import * as postings from "@/db/queries/postings";
import * as rooms from "@/db/queries/rooms";
import * as stock from "@/db/queries/stock";
import * as stockImport from "@/db/queries/stock-import";
import { balloonFamilies, balloons } from "@/db/schema";
import type { CsvRow } from "@/lib/stock/csv";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { acceptInvitationIn } from "@/lib/ops/accounts";
import { accountWrite, labWrite } from "@/lib/ops/write";
import { labWithTeam, stentPlatformFor } from "./fixtures";

type Write<A> = (tx: Tx, args: A) => Promise<unknown>;
function inLab<A extends { labId: number }, R>(fn: (tx: Tx, args: A) => Promise<R>) {
  return (args: A): Promise<R> => labWrite(args.labId, (tx) => fn(tx, args));
}
export type { Write };

export const createChart = inLab(charts.createChart);
export const updateChart = inLab(charts.updateChart);
export const createEdition = inLab(editions.createEdition);
export const approveEdition = inLab(editions.approveEdition);
export const rejectEdition = inLab(editions.rejectEdition);
export const withdrawEdition = inLab(editions.withdrawEdition);
export const createRoom = inLab(rooms.createRoom);
export const recordPosting = inLab(postings.recordPosting);
export const takeDownPosting = inLab(postings.takeDownPosting);
export const changeMemberRole = inLab(members.changeMemberRole);
export const removeMember = inLab(members.removeMember);
export const createBalloonFamily = inLab(stock.createBalloonFamily);
export const updateBalloonFamily = inLab(stock.updateBalloonFamily);
export const deleteBalloonFamily = inLab(stock.deleteBalloonFamily);
export const createBalloon = inLab(stock.createBalloon);
export const updateBalloon = inLab(stock.updateBalloon);
export const deleteBalloon = inLab(stock.deleteBalloon);
export const createStentPlatform = inLab(stock.createStentPlatform);
export const updateStentPlatform = inLab(stock.updateStentPlatform);
export const deleteStentPlatform = inLab(stock.deleteStentPlatform);
export const createStentSize = inLab(stock.createStentSize);
export const updateStentSize = inLab(stock.updateStentSize);
export const deleteStentSize = inLab(stock.deleteStentSize);

/** The CSV import as the API runs it: a dry run previews, otherwise one write. */
export function importBalloons(args: {
  labId: number;
  actorUserId: number | null;
  rows: CsvRow[];
  dryRun: boolean;
  expectRevision?: number;
  fileName?: string;
}) {
  if (args.dryRun) return stockImport.previewStockImport(args);
  return labWrite(args.labId, (tx) => stockImport.importStock(tx, args));
}

export const revokeInvitation = inLab(invitations.revokeInvitation);

/** Accepting belongs to no lab until the invitation is read: one plain transaction. */
export function acceptInvitation(args: Parameters<typeof acceptInvitationIn>[1]) {
  return accountWrite((tx) => acceptInvitationIn(tx, args));
}

/**
 * A lab with one person in each role, an invented NC balloon family (nominal 10 atm, RBP 18 atm)
 * stocked at `diameters`, and a small Murray POT chart over it (rows 3-3.5, columns 2.5-3, A4 at
 * 1 m, legible) drafted by the educator: what the sign-off and check tests start from.
 */
export async function labWithSmallChart({
  name,
  diameters = [2.5, 2.75, 3, 3.25, 3.5, 3.75, 4, 4.25, 4.5],
}: {
  name: string;
  diameters?: number[];
}) {
  const team = await labWithTeam();
  const [fam] = await db
    .insert(balloonFamilies)
    .values({ labId: team.lab.id, name: `NC ${name}`, compliance: "nc", nominalAtm: 10, rbpAtm: 18, growthAtRbpMm: 0 })
    .$returningId();
  const balloonIds: number[] = [];
  for (const diameterMm of diameters) {
    const [b] = await db.insert(balloons).values({ labId: team.lab.id, familyId: fam!.id, diameterMm }).$returningId();
    balloonIds.push(b!.id);
  }
  const definition = chartDefinitionSchema.parse({
    title: `${name} chart`,
    law: { law: "murray" },
    lookups: [{ kind: "proximal", familyId: fam!.id, rounding: "up", rows: [3, 3.5], cols: [2.5, 3] }],
    stentPlatformId: await stentPlatformFor(team.lab.id),
    paper: "A4",
    orientation: "portrait",
    readingDistanceM: 1,
  });
  const chartId = (await createChart({ labId: team.lab.id, userId: team.people.educator.id, definition })).id;
  return { team, familyId: fam!.id, balloonIds, chartId };
}
