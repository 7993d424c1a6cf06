// The demo scenario's records (invented; PRODUCT.md "Demo scenario"): Larkspur Commons (inch-pound
// project: values are written in the units the crew reads and stored in SI) and the Millrace Pump
// House (SI), from 28 Oct to 27 Nov 2026, Chicago time. It includes a hot, windy afternoon with a
// high evaporation rate, a cold night under blankets, a late truck with water added at the chute,
// a slump out of tolerance, a rejected load, a held placement and a low 28-day strength test.
import { fToC, galToL, inToMm, lbFt3ToKgM3, mphToKmh, psiToMPa, yd3ToM3 } from "@/lib/concrete/units";
import type { RecordType } from "@/lib/records/registry";
import { chicago, DEMO_IDS, demoId, type DemoRecord } from "./ids";
import { maturityDemoRecords } from "./maturity-data";

const hoursBefore = (date: Date, hours: number) => new Date(date.getTime() - hours * 3_600_000);
const waterPerYd3 = (gal: number) => galToL(gal) / yd3ToM3(1);
const areaMm2 = (diameterMm: number) => (Math.PI * diameterMm * diameterMm) / 4;
const round = (value: number, digits: number) => Math.round(value * 10 ** digits) / 10 ** digits;

/**
 * The scenario's records in dependency order (parents before their records), built on call.
 */
export function demoRecords(): [RecordType, DemoRecord[]][] {
  const L = DEMO_IDS.projects.larkspur;
  const M = DEMO_IDS.projects.millrace;
  const { sam, ines, olu } = DEMO_IDS.users;

  // ── Mix designs (Brindlewood Ready-Mix, invented) ──────────────────────────────────────────────
  const MIX = { lc4000a: demoId(0x101), lc5000w: demoId(0x102), lc5000d: demoId(0x103), mph30: demoId(0x104), mph35: demoId(0x105) };
  const mix = (projectId: string, day: string, values: Record<string, unknown>): DemoRecord => ({
    projectId,
    by: olu,
    recordedAt: chicago(day, "10:00"),
    values: { supplier: "Brindlewood Ready-Mix", fcAgeDays: 28, ...values },
  });
  const mixes: DemoRecord[] = [
    mix(L, "2026-10-05", {
      id: MIX.lc4000a, code: "LC-4000-A", fcMPa: psiToMPa(4000), maxWcm: 0.45, slumpTargetMm: inToMm(4), slumpType: "target",
      airTargetPct: 5.5, maxConcreteTempC: fToC(95), cementType: "Type I/II", scms: "20 % Class F fly ash",
      siteWaterAllowedLPerM3: waterPerYd3(1), lowBleed: false,
    }),
    mix(L, "2026-10-05", {
      id: MIX.lc5000w, code: "LC-5000-W", fcMPa: psiToMPa(5000), maxWcm: 0.42, slumpTargetMm: inToMm(5), slumpType: "maximum",
      maxConcreteTempC: fToC(95), cementType: "Type I/II", scms: "30 % slag cement", siteWaterAllowedLPerM3: waterPerYd3(1), lowBleed: false,
    }),
    mix(L, "2026-10-06", {
      id: MIX.lc5000d, code: "LC-5000-D", fcMPa: psiToMPa(5000), maxWcm: 0.4, slumpTargetMm: inToMm(4), slumpType: "target",
      maxConcreteTempC: fToC(95), cementType: "Type I/II", scms: "8 % silica fume, 15 % Class F fly ash",
      siteWaterAllowedLPerM3: waterPerYd3(0.5), lowBleed: true,
    }),
    mix(M, "2026-10-20", {
      id: MIX.mph30, code: "MPH-30", fcMPa: 30, maxWcm: 0.45, slumpTargetMm: 100, slumpType: "target", airTargetPct: 6,
      maxConcreteTempC: 32, cementType: "GU", scms: "25 % slag cement", siteWaterAllowedLPerM3: 5, lowBleed: false,
    }),
    mix(M, "2026-10-20", {
      id: MIX.mph35, code: "MPH-35-56", fcMPa: 35, fcAgeDays: 56, maxWcm: 0.4, slumpTargetMm: 100, slumpType: "target",
      airTargetPct: 6, maxConcreteTempC: 30, cementType: "GUL", scms: "35 % slag cement", siteWaterAllowedLPerM3: 0, lowBleed: false,
    }),
  ];

  // ── Placements: every state of the workflow ────────────────────────────────────────────────────
  const P = {
    podiumEast: demoId(0x201), podiumWest: demoId(0x202), wallsL1: demoId(0x203), deckL2: demoId(0x204),
    wallsL2: demoId(0x205), deckL3: demoId(0x206), wallsL3: demoId(0x207),
    wellBase: demoId(0x211), wellWalls: demoId(0x212), pumpRoom: demoId(0x213), valveChamber: demoId(0x214),
  };
  type PlacementSpec = {
    id: string; projectId: string; element: string; level: string; grid: string; elementType: string;
    leastDimensionMm: number; plannedVolumeM3: number; mixId: string; start: Date;
    state: string; holdReason?: string; signedAt?: Date;
  };
  const placement = (p: PlacementSpec): DemoRecord => ({
    projectId: p.projectId,
    by: sam,
    recordedAt: hoursBefore(p.start, 72),
    values: {
      id: p.id, element: p.element, level: p.level, grid: p.grid, elementType: p.elementType,
      leastDimensionMm: p.leastDimensionMm, plannedVolumeM3: p.plannedVolumeM3, mixId: p.mixId, plannedStart: p.start,
    },
    // A signed placement is inserted as placed and signed after its records (see seed-records.ts).
    extra: { state: p.signedAt ? "placed" : p.state, holdReason: p.holdReason ?? null },
    ...(p.signedAt ? { signedAt: p.signedAt, signedBy: ines } : {}),
  });
  const placementsData: DemoRecord[] = [
    placement({ id: P.podiumEast, projectId: L, element: "Podium slab, east half", level: "Podium", grid: "A–F / 1–5", elementType: "elevated-slab",
      leastDimensionMm: inToMm(12), plannedVolumeM3: yd3ToM3(150), mixId: MIX.lc4000a, start: chicago("2026-10-28", "06:30"), state: "signed",
      signedAt: chicago("2026-10-28", "15:10") }),
    placement({ id: P.podiumWest, projectId: L, element: "Podium slab, west half", level: "Podium", grid: "F–L / 1–5", elementType: "elevated-slab",
      leastDimensionMm: inToMm(12), plannedVolumeM3: yd3ToM3(140), mixId: MIX.lc4000a, start: chicago("2026-11-04", "06:30"), state: "signed",
      signedAt: chicago("2026-11-04", "14:40") }),
    placement({ id: P.wallsL1, projectId: L, element: "Shear walls SW-1 to SW-4, level 1 to 2", level: "L1", grid: "C/2, C/4, H/2, H/4", elementType: "wall",
      leastDimensionMm: inToMm(12), plannedVolumeM3: yd3ToM3(38), mixId: MIX.lc5000w, start: chicago("2026-11-10", "07:00"), state: "placed" }),
    placement({ id: P.deckL2, projectId: L, element: "Level 2 deck", level: "L2", grid: "A–L / 1–5", elementType: "elevated-slab",
      leastDimensionMm: inToMm(9), plannedVolumeM3: yd3ToM3(118), mixId: MIX.lc5000d, start: chicago("2026-11-17", "09:30"), state: "placed" }),
    placement({ id: P.wallsL2, projectId: L, element: "Shear walls SW-1 to SW-4, level 2 to 3", level: "L2", grid: "C/2, C/4, H/2, H/4", elementType: "wall",
      leastDimensionMm: inToMm(12), plannedVolumeM3: yd3ToM3(34), mixId: MIX.lc5000w, start: chicago("2026-11-20", "07:00"), state: "held",
      holdReason: "Cover at SW-3 measured 1 in where the drawings require 2 in; chairs missing at grid C/4. Re-inspect after fixing." }),
    placement({ id: P.deckL3, projectId: L, element: "Level 3 deck", level: "L3", grid: "A–L / 1–5", elementType: "elevated-slab",
      leastDimensionMm: inToMm(9), plannedVolumeM3: yd3ToM3(118), mixId: MIX.lc5000d, start: chicago("2026-11-30", "06:00"), state: "cleared" }),
    placement({ id: P.wallsL3, projectId: L, element: "Shear walls SW-1 to SW-4, level 3 to 4", level: "L3", grid: "C/2, C/4, H/2, H/4", elementType: "wall",
      leastDimensionMm: inToMm(12), plannedVolumeM3: yd3ToM3(34), mixId: MIX.lc5000w, start: chicago("2026-12-03", "07:00"), state: "planned" }),
    placement({ id: P.wellBase, projectId: M, element: "Wet well base slab and footings", level: "B1", grid: "W1–W3 / A–C", elementType: "footing",
      leastDimensionMm: 600, plannedVolumeM3: 42, mixId: MIX.mph30, start: chicago("2026-11-09", "07:30"), state: "signed",
      signedAt: chicago("2026-11-09", "13:20") }),
    placement({ id: P.wellWalls, projectId: M, element: "Wet well walls, lift 1", level: "B1", grid: "W1–W3 / A–C", elementType: "wall",
      leastDimensionMm: 300, plannedVolumeM3: 28, mixId: MIX.mph35, start: chicago("2026-11-12", "08:00"), state: "placed" }),
    placement({ id: P.pumpRoom, projectId: M, element: "Pump room slab on ground", level: "Ground", grid: "P1–P4 / A–D", elementType: "slab-on-ground",
      leastDimensionMm: 200, plannedVolumeM3: 36, mixId: MIX.mph30, start: chicago("2026-11-30", "07:00"), state: "ready" }),
    placement({ id: P.valveChamber, projectId: M, element: "Valve chamber walls", level: "B1", grid: "V1–V2 / D–E", elementType: "wall",
      leastDimensionMm: 250, plannedVolumeM3: 14, mixId: MIX.mph30, start: chicago("2026-11-27", "08:00"), state: "placing" }),
  ];

  // ── Deliveries (truck tickets) ─────────────────────────────────────────────────────────────────
  const D = {
    pe1: demoId(0x301), pe2: demoId(0x302), pe3: demoId(0x303), pw1: demoId(0x304), pw2: demoId(0x305),
    w1: demoId(0x306), w2late: demoId(0x307), w3: demoId(0x308), d1: demoId(0x309), d2: demoId(0x30a), d3: demoId(0x30b), d4rejected: demoId(0x30c),
    wb1: demoId(0x311), wb2: demoId(0x312), ww1: demoId(0x313), ww2: demoId(0x314), vc1: demoId(0x315),
  };
  type Truck = { id: string; projectId: string; placementId: string; day: string; ticket: string; truck: string; volumeM3: number;
    batched: string; arrived: string; start?: string; finish?: string; values?: Record<string, unknown> };
  const delivery = (t: Truck): DemoRecord => ({
    projectId: t.projectId,
    by: sam,
    recordedAt: chicago(t.day, t.finish ?? t.arrived),
    values: {
      id: t.id, placementId: t.placementId, ticketNumber: t.ticket, truck: t.truck, volumeM3: t.volumeM3,
      batchedAt: chicago(t.day, t.batched), arrivedAt: chicago(t.day, t.arrived),
      dischargeStartedAt: t.start ? chicago(t.day, t.start) : null, dischargeFinishedAt: t.finish ? chicago(t.day, t.finish) : null,
      ...t.values,
    },
  });
  const ten = yd3ToM3(10);
  const deliveriesData: DemoRecord[] = [
    delivery({ id: D.pe1, projectId: L, placementId: P.podiumEast, day: "2026-10-28", ticket: "BR-240118", truck: "27", volumeM3: ten, batched: "06:02", arrived: "06:31", start: "06:36", finish: "07:01" }),
    delivery({ id: D.pe2, projectId: L, placementId: P.podiumEast, day: "2026-10-28", ticket: "BR-240119", truck: "31", volumeM3: ten, batched: "06:14", arrived: "06:44", start: "07:02", finish: "07:24" }),
    delivery({ id: D.pe3, projectId: L, placementId: P.podiumEast, day: "2026-10-28", ticket: "BR-240124", truck: "19", volumeM3: ten, batched: "06:40", arrived: "07:12", start: "07:25", finish: "07:49" }),
    delivery({ id: D.pw1, projectId: L, placementId: P.podiumWest, day: "2026-11-04", ticket: "BR-241402", truck: "27", volumeM3: ten, batched: "06:05", arrived: "06:33", start: "06:38", finish: "07:02" }),
    delivery({ id: D.pw2, projectId: L, placementId: P.podiumWest, day: "2026-11-04", ticket: "BR-241405", truck: "12", volumeM3: ten, batched: "06:20", arrived: "06:52", start: "07:03", finish: "07:27" }),
    delivery({ id: D.w1, projectId: L, placementId: P.wallsL1, day: "2026-11-10", ticket: "BR-242210", truck: "19", volumeM3: ten, batched: "06:35", arrived: "07:02", start: "07:08", finish: "07:40" }),
    // The late truck: held at the rail crossing, water added at the chute, discharge done 96 min after batching.
    delivery({ id: D.w2late, projectId: L, placementId: P.wallsL1, day: "2026-11-10", ticket: "BR-242213", truck: "31", volumeM3: ten, batched: "07:05", arrived: "08:10", start: "08:18", finish: "08:41",
      values: { revolutions: 286, waterAddedL: galToL(10), waterFirstAt: chicago("2026-11-10", "08:12"), waterLastAt: chicago("2026-11-10", "08:15"),
        waterAddedBy: "Driver, truck 31", waterAuthorisedBy: "Sam Okafor (superintendent)", admixtureNote: "None added at site" } }),
    delivery({ id: D.w3, projectId: L, placementId: P.wallsL1, day: "2026-11-10", ticket: "BR-242219", truck: "12", volumeM3: yd3ToM3(8), batched: "08:02", arrived: "08:30", start: "08:42", finish: "09:05" }),
    delivery({ id: D.d1, projectId: L, placementId: P.deckL2, day: "2026-11-17", ticket: "BR-243101", truck: "27", volumeM3: ten, batched: "09:40", arrived: "10:08", start: "10:14", finish: "10:40" }),
    delivery({ id: D.d2, projectId: L, placementId: P.deckL2, day: "2026-11-17", ticket: "BR-243107", truck: "19", volumeM3: ten, batched: "11:50", arrived: "12:21", start: "12:26", finish: "12:52" }),
    delivery({ id: D.d3, projectId: L, placementId: P.deckL2, day: "2026-11-17", ticket: "BR-243115", truck: "12", volumeM3: ten, batched: "13:30", arrived: "13:58", start: "14:02", finish: "14:27" }),
    delivery({ id: D.d4rejected, projectId: L, placementId: P.deckL2, day: "2026-11-17", ticket: "BR-243118", truck: "44", volumeM3: ten, batched: "13:48", arrived: "14:25",
      values: { status: "rejected", rejectReason: "Concrete at 97 °F on arrival, above the 95 °F limit of the mix and ACI 305.1; returned to the plant." } }),
    delivery({ id: D.wb1, projectId: M, placementId: P.wellBase, day: "2026-11-09", ticket: "BR-M-0907", truck: "8", volumeM3: 8, batched: "07:05", arrived: "07:31", start: "07:36", finish: "08:02" }),
    delivery({ id: D.wb2, projectId: M, placementId: P.wellBase, day: "2026-11-09", ticket: "BR-M-0911", truck: "14", volumeM3: 8, batched: "07:30", arrived: "07:58", start: "08:03", finish: "08:30" }),
    delivery({ id: D.ww1, projectId: M, placementId: P.wellWalls, day: "2026-11-12", ticket: "BR-M-1204", truck: "8", volumeM3: 7, batched: "07:40", arrived: "08:06", start: "08:12", finish: "08:45" }),
    delivery({ id: D.ww2, projectId: M, placementId: P.wellWalls, day: "2026-11-12", ticket: "BR-M-1209", truck: "14", volumeM3: 7, batched: "08:25", arrived: "08:52", start: "08:55", finish: "09:31" }),
    // Today's pour, still discharging.
    delivery({ id: D.vc1, projectId: M, placementId: P.valveChamber, day: "2026-11-27", ticket: "BR-M-2702", truck: "8", volumeM3: 7, batched: "07:45", arrived: "08:12", start: "08:20" }),
  ];

  // ── Field tests ─────────────────────────────────────────────────────────────────────────────────
  const fieldTest = (n: number, projectId: string, placementId: string, deliveryId: string, sampledAt: Date, values: Record<string, unknown>): DemoRecord => ({
    projectId, by: ines, recordedAt: sampledAt, values: { id: demoId(n), placementId, deliveryId, sampledAt, ...values },
  });
  const ipTest = (slumpIn: number, airPct: number | null, concreteF: number, airF: number, densityPcf: number | null) => ({
    slumpMm: inToMm(slumpIn), airPct, concreteTempC: fToC(concreteF), airTempC: fToC(airF), densityKgM3: densityPcf === null ? null : lbFt3ToKgM3(densityPcf),
  });
  const fieldTestsData: DemoRecord[] = [
    fieldTest(0x401, L, P.podiumEast, D.pe1, chicago("2026-10-28", "06:40"), ipTest(4, 5.8, 68, 55, 144.2)),
    fieldTest(0x402, L, P.podiumEast, D.pe3, chicago("2026-10-28", "07:30"), ipTest(4.5, 5.2, 69, 58, 144.8)),
    fieldTest(0x403, L, P.podiumWest, D.pw1, chicago("2026-11-04", "06:42"), ipTest(3.75, 6.1, 66, 50, 143.9)),
    fieldTest(0x404, L, P.wallsL1, D.w1, chicago("2026-11-10", "07:12"), ipTest(4.5, null, 64, 47, 147.6)),
    fieldTest(0x405, L, P.wallsL1, D.w2late, chicago("2026-11-10", "08:22"), { ...ipTest(5, null, 66, 52, 146.9), notes: "Sampled after water was added at the chute." }),
    // The slump out of tolerance (4 in ± 1 in) and its check test on another portion of the same load.
    fieldTest(0x406, L, P.deckL2, D.d1, chicago("2026-11-17", "10:18"), { ...ipTest(6.5, null, 88, 84, null), notes: "Slump 6½ in is outside 3–5 in. Check test on another portion of the same load." }),
    fieldTest(0x407, L, P.deckL2, D.d1, chicago("2026-11-17", "10:26"), { ...ipTest(5, null, 88, 84, 145.6), notes: "Check test within tolerance; load accepted." }),
    fieldTest(0x408, L, P.deckL2, D.d3, chicago("2026-11-17", "14:06"), ipTest(4.25, null, 92, 95, 145.1)),
    fieldTest(0x411, M, P.wellBase, D.wb1, chicago("2026-11-09", "07:40"), { slumpMm: 90, airPct: 6.2, concreteTempC: 16, airTempC: 6, densityKgM3: 2315 }),
    fieldTest(0x412, M, P.wellWalls, D.ww1, chicago("2026-11-12", "08:16"), { slumpMm: 110, airPct: 5.8, concreteTempC: 15, airTempC: 3, densityKgM3: 2322 }),
    fieldTest(0x413, M, P.valveChamber, D.vc1, chicago("2026-11-27", "08:24"), { slumpMm: 95, airPct: 6.4, concreteTempC: 17, airTempC: 9, densityKgM3: 2310 }),
  ];

  // ── Specimen sets and breaks (Fenwick Hollow Materials Lab, invented) ────────────────────────────
  const S = { peA: demoId(0x501), peB: demoId(0x502), pw: demoId(0x503), w: demoId(0x504), d: demoId(0x505), wb: demoId(0x511), ww: demoId(0x512) };
  const set = (id: string, projectId: string, placementId: string, deliveryId: string, castAt: Date, values: Record<string, unknown>): DemoRecord => ({
    projectId, by: ines, recordedAt: castAt,
    values: { id, placementId, deliveryId, castAt, cylinderDiameterMm: 100, cylinderLengthMm: 200, count: 5, testAgesDays: [7, 28], ...values },
  });
  const four = { cylinderDiameterMm: 100, cylinderLengthMm: inToMm(8), initialCuringMinC: fToC(66), initialCuringMaxC: fToC(76) };
  const specimenSetsData: DemoRecord[] = [
    set(S.peA, L, P.podiumEast, D.pe1, chicago("2026-10-28", "06:50"), { setCode: "LC-P1-A", ...four }),
    set(S.peB, L, P.podiumEast, D.pe3, chicago("2026-10-28", "07:40"), { setCode: "LC-P1-B", ...four }),
    set(S.pw, L, P.podiumWest, D.pw1, chicago("2026-11-04", "06:52"), { setCode: "LC-P2-A", ...four }),
    set(S.w, L, P.wallsL1, D.w2late, chicago("2026-11-10", "08:30"), { setCode: "LC-SW1-A", ...four }),
    set(S.d, L, P.deckL2, D.d3, chicago("2026-11-17", "14:15"), { setCode: "LC-D2-A", ...four, initialCuringMinC: fToC(70), initialCuringMaxC: fToC(80) }),
    set(S.wb, M, P.wellBase, D.wb1, chicago("2026-11-09", "07:50"), { setCode: "MPH-F-A", initialCuringMinC: 17, initialCuringMaxC: 22 }),
    set(S.ww, M, P.wellWalls, D.ww1, chicago("2026-11-12", "08:25"), { setCode: "MPH-W1-A", testAgesDays: [7, 56], initialCuringMinC: 16, initialCuringMaxC: 22 }),
  ];

  let breakN = 0x600;
  /** A break entered by the office; the load is what the lab's machine showed for that strength. */
  const breakOf = (projectId: string, specimenSetId: string, testedAt: Date, ageDays: number, strengthMPa: number, fractureType: number, diameterMm = inToMm(4), lengthMm = inToMm(8)): DemoRecord => ({
    projectId, by: olu, recordedAt: testedAt,
    values: { id: demoId(++breakN), specimenSetId, testedAt, ageDays, loadKN: round((strengthMPa * areaMm2(diameterMm)) / 1000, 1), diameterMm, lengthMm, fractureType },
  });
  const psi = psiToMPa;
  const breaksData: DemoRecord[] = [
    breakOf(L, S.peA, chicago("2026-11-04", "09:10"), 7, psi(2980), 2),
    breakOf(L, S.peA, chicago("2026-11-04", "09:14"), 7, psi(3050), 1),
    breakOf(L, S.peB, chicago("2026-11-04", "09:20"), 7, psi(2640), 2),
    breakOf(L, S.peB, chicago("2026-11-04", "09:24"), 7, psi(2710), 3),
    breakOf(L, S.peA, chicago("2026-11-25", "09:05"), 28, psi(4460), 2),
    breakOf(L, S.peA, chicago("2026-11-25", "09:09"), 28, psi(4390), 1),
    breakOf(L, S.peA, chicago("2026-11-25", "09:13"), 28, psi(4520), 2),
    // The low 28-day strength test: average 3363 psi, below f'c − 500 psi (ACI 318-19 §26.12.3.1 b).
    breakOf(L, S.peB, chicago("2026-11-25", "09:20"), 28, psi(3380), 3),
    breakOf(L, S.peB, chicago("2026-11-25", "09:24"), 28, psi(3290), 5),
    breakOf(L, S.peB, chicago("2026-11-25", "09:28"), 28, psi(3420), 3),
    breakOf(L, S.pw, chicago("2026-11-11", "09:00"), 7, psi(3010), 2),
    breakOf(L, S.pw, chicago("2026-11-11", "09:04"), 7, psi(2940), 2),
    breakOf(L, S.w, chicago("2026-11-17", "09:00"), 7, psi(3420), 1),
    breakOf(L, S.w, chicago("2026-11-17", "09:04"), 7, psi(3510), 2),
    breakOf(L, S.d, chicago("2026-11-24", "09:00"), 7, psi(3650), 2),
    breakOf(L, S.d, chicago("2026-11-24", "09:04"), 7, psi(3580), 2),
    breakOf(M, S.wb, chicago("2026-11-16", "10:00"), 7, 21.2, 2, 100, 200),
    breakOf(M, S.wb, chicago("2026-11-16", "10:04"), 7, 20.7, 1, 100, 200),
    breakOf(M, S.ww, chicago("2026-11-19", "10:00"), 7, 17.9, 2, 100, 200),
    breakOf(M, S.ww, chicago("2026-11-19", "10:04"), 7, 18.4, 2, 100, 200),
  ];

  // ── Weather: the hot, windy afternoon and the cold night ────────────────────────────────────────
  const weather = (n: number, projectId: string, placementId: string | null, observedAt: Date, values: Record<string, unknown>, by: string = sam): DemoRecord => ({
    projectId, by, recordedAt: observedAt, values: { id: demoId(n), placementId, observedAt, ...values },
  });
  const ipWeather = (airF: number, rh: number, mph: number, concreteF: number | null, sun: string | null) => ({
    airTempC: fToC(airF), relativeHumidityPct: rh, windKmh: mphToKmh(mph), concreteTempC: concreteF === null ? null : fToC(concreteF), sun,
  });
  const weatherData: DemoRecord[] = [
    weather(0x701, L, P.podiumEast, chicago("2026-10-28", "07:00"), ipWeather(55, 72, 6, 68, "overcast")),
    weather(0x702, L, P.deckL2, chicago("2026-11-17", "10:00"), ipWeather(84, 45, 10, 88, "sun")),
    weather(0x703, L, P.deckL2, chicago("2026-11-17", "14:00"), ipWeather(95, 30, 18, 92, "sun"), ines),
    weather(0x704, L, P.deckL2, chicago("2026-11-17", "16:30"), ipWeather(90, 34, 14, 90, "sun")),
    weather(0x705, L, null, chicago("2026-11-24", "07:00"), ipWeather(38, 81, 7, null, "overcast")),
    weather(0x711, M, P.wellWalls, chicago("2026-11-12", "16:00"), { airTempC: 3, relativeHumidityPct: 70, windKmh: 12, concreteTempC: 15, sun: "overcast" }),
    weather(0x712, M, P.wellWalls, chicago("2026-11-12", "23:00"), { airTempC: -6, relativeHumidityPct: 80, windKmh: 8, concreteTempC: 13, sun: null }),
    weather(0x713, M, P.wellWalls, chicago("2026-11-13", "05:00"), { airTempC: -4, relativeHumidityPct: 85, windKmh: 5, concreteTempC: 11, sun: null }),
    weather(0x714, M, null, chicago("2026-11-27", "07:30"), { airTempC: 8, relativeHumidityPct: 65, windKmh: 10, concreteTempC: null, sun: "overcast" }),
  ];

  // ── Checklists and their answers ────────────────────────────────────────────────────────────────
  const C = { peReady: demoId(0x801), d2Hot: demoId(0x802), w2Ready: demoId(0x803), d3Ready: demoId(0x804), wwCold: demoId(0x811), prReady: demoId(0x812) };
  const checklist = (id: string, projectId: string, placementId: string, kind: string, at: Date, by: string): DemoRecord => ({
    projectId, by, recordedAt: at, values: { id, placementId, kind },
  });
  const checklistsData: DemoRecord[] = [
    checklist(C.peReady, L, P.podiumEast, "readiness", chicago("2026-10-27", "15:00"), ines),
    checklist(C.d2Hot, L, P.deckL2, "hot-weather", chicago("2026-11-17", "08:30"), sam),
    checklist(C.w2Ready, L, P.wallsL2, "readiness", chicago("2026-11-19", "15:30"), ines),
    checklist(C.d3Ready, L, P.deckL3, "readiness", chicago("2026-11-26", "14:00"), ines),
    checklist(C.wwCold, M, P.wellWalls, "cold-weather", chicago("2026-11-12", "07:00"), sam),
    checklist(C.prReady, M, P.pumpRoom, "readiness", chicago("2026-11-26", "15:00"), sam),
  ];
  const READINESS: [string, string][] = [
    ["forms", "Forms tight, braced and clean"],
    ["reinforcement", "Reinforcement as drawn, tied and supported"],
    ["cover", "Cover to reinforcement as specified"],
    ["embeds", "Embeds, sleeves and blockouts in place"],
    ["cleanliness", "Forms free of debris, water and ice"],
    ["access", "Access for trucks and pump"],
    ["pump", "Pump set up and primed"],
    ["vibrators", "Standby vibrators on site"],
  ];
  let itemN = 0x900;
  const items = (projectId: string, checklistId: string, at: Date, by: string, list: [string, string][], answers: Record<string, [string | null, string?]>): DemoRecord[] =>
    list.map(([itemKey, label]) => {
      const [answer, note] = answers[itemKey] ?? ["yes"];
      return { projectId, by, recordedAt: at, values: { id: demoId(++itemN), checklistId, itemKey, label, answer, note: note ?? null } };
    });
  const checklistItemsData: DemoRecord[] = [
    ...items(L, C.peReady, chicago("2026-10-27", "15:20"), ines, READINESS, {}),
    ...items(L, C.d2Hot, chicago("2026-11-17", "08:40"), sam, [
      ["reducer", "Evaporation reducer on site"],
      ["fogging", "Fogging equipment ready"],
      ["windbreaks", "Windbreaks up on the exposed edges"],
      ["cylinder-shade", "Shade and a cool box for the cylinders"],
      ["curing", "Curing compound and wet burlap ready"],
      ["hours", "Placement moved to cooler hours"],
    ], { windbreaks: ["no", "Not possible at the deck edge; fogging instead."], hours: ["na", "Pump booked for the day; cannot move."] }),
    ...items(L, C.w2Ready, chicago("2026-11-19", "15:40"), ines, READINESS, {
      cover: ["no", "1 in measured at SW-3; drawings require 2 in."],
      reinforcement: ["no", "Chairs missing at grid C/4."],
    }),
    ...items(L, C.d3Ready, chicago("2026-11-26", "14:20"), ines, READINESS, {}),
    ...items(M, C.wwCold, chicago("2026-11-12", "07:10"), sam, [
      ["blankets", "Insulated blankets on site for all faces"],
      ["heater-vented", "Heaters vented outside the enclosure (carbon monoxide)"],
      ["no-frost", "Forms and reinforcement free of frost and ice"],
      ["loggers", "Temperature loggers placed in the walls"],
      ["cylinders-box", "Heated curing box for the cylinders"],
    ], {}),
    ...items(M, C.prReady, chicago("2026-11-26", "15:10"), sam, READINESS.slice(0, 5), { embeds: [null], cleanliness: [null] }),
  ];

  // ── Protection and curing ───────────────────────────────────────────────────────────────────────
  let curingN = 0xa00;
  const curing = (projectId: string, placementId: string, method: string, readAt: Date, tempC: number, location: string, note?: string): DemoRecord => ({
    projectId, by: sam, recordedAt: readAt, values: { id: demoId(++curingN), placementId, method, readAt, tempC, location, note: note ?? null },
  });
  const BLANKETS = "Insulated blankets, indirect-fired heater in a tarp enclosure";
  const curingData: DemoRecord[] = [
    curing(M, P.wellWalls, BLANKETS, chicago("2026-11-12", "18:00"), 16, "Wall W-2, north face logger"),
    curing(M, P.wellWalls, BLANKETS, chicago("2026-11-12", "22:00"), 14, "Wall W-2, north face logger"),
    curing(M, P.wellWalls, BLANKETS, chicago("2026-11-12", "22:05"), 8, "Enclosure air"),
    curing(M, P.wellWalls, BLANKETS, chicago("2026-11-13", "02:00"), 12, "Wall W-2, north face logger", "Heater refuelled at 01:40."),
    curing(M, P.wellWalls, BLANKETS, chicago("2026-11-13", "06:00"), 11, "Wall W-2, north face logger"),
    curing(M, P.wellWalls, BLANKETS, chicago("2026-11-13", "12:00"), 13, "Wall W-2, north face logger"),
    curing(L, P.deckL2, "Curing compound, then wet burlap", chicago("2026-11-17", "18:00"), fToC(88), "Deck centre, grid F/3"),
    curing(L, P.deckL2, "Curing compound, then wet burlap", chicago("2026-11-18", "06:00"), fToC(74), "Deck centre, grid F/3"),
  ];

  // ── Daily diaries ───────────────────────────────────────────────────────────────────────────────
  let diaryChildN = 0xc00;
  type Diary = { n: number; projectId: string; date: string; weatherSummary: string; workDone: string; safetyNotes: string; submitted: boolean;
    crew: [string, number][]; equipment: [string, number, number][]; delays: [string, number, string][]; visitors: [string, string, string][] };
  const diaries: Diary[] = [
    { n: 0xb01, projectId: L, date: "2026-11-10", weatherSummary: "Clear, 41–58 °F, light wind",
      workDone: "Placed shear walls SW-1 to SW-4 (L1 to L2), 28 yd³. Truck 31 was held at the rail crossing; water added at the chute (10 gal) with the superintendent's approval, discharge done 96 min after batching.",
      safetyNotes: "Toolbox talk on working near the pump boom.", submitted: true,
      crew: [["Carpenters", 6], ["Laborers", 5], ["Pump operator", 1]], equipment: [["Boom pump 38 m", 1, 5]],
      delays: [["Late truck", 25, "Truck 31 held at the rail crossing on Millbank Road"]], visitors: [["Dale Pruitt", "Fenwick Hollow Materials Lab", "Cylinder pick-up"]] },
    { n: 0xb02, projectId: L, date: "2026-11-17", weatherSummary: "Hot, dry and windy: 95 °F at 2 pm, 30 % RH, 18 mph",
      workDone: "Placed the level 2 deck. Fogging and evaporation reducer from 1 pm; one load rejected at 97 °F. Curing compound, then wet burlap at 5 pm.",
      safetyNotes: "Water breaks every hour for the finishing crew (heat).", submitted: true,
      crew: [["Finishers", 8], ["Laborers", 6], ["Pump operator", 1], ["Ironworkers (standby)", 2]],
      equipment: [["Boom pump 47 m", 1, 8], ["Power trowels", 3, 5], ["Fogging nozzles", 4, 4]],
      delays: [["Rejected load", 20, "Truck 44 at 97 °F; waited for the next load"]],
      visitors: [["Marta Quell", "Thistle & Reed Engineering", "Engineer of record's site visit"]] },
    { n: 0xb03, projectId: L, date: "2026-11-19", weatherSummary: "Overcast, 48–55 °F",
      workDone: "Readiness review of the L2–L3 shear walls: held for cover at SW-3 and missing chairs at C/4. Rebar crew fixing tomorrow morning.",
      safetyNotes: "", submitted: true, crew: [["Ironworkers", 4], ["Carpenters", 5]], equipment: [], delays: [["Inspection hold", 0, "Pour moved; no standby time"]], visitors: [] },
    { n: 0xb04, projectId: L, date: "2026-11-24", weatherSummary: "Cold start, 38 °F at 7 am, overcast",
      workDone: "Formed level 3 deck edges; reinforcement placed on the east half.", safetyNotes: "Ice on the ramp salted at 7 am.", submitted: false,
      crew: [["Carpenters", 7], ["Ironworkers", 6]], equipment: [["Tower crane", 1, 8]], delays: [], visitors: [] },
    { n: 0xb11, projectId: M, date: "2026-11-12", weatherSummary: "3 °C falling to −6 °C overnight, light wind",
      workDone: "Placed wet well walls lift 1, 14 m³. Blankets and a vented heater in a tarp enclosure; readings every 4 hours through the night.",
      safetyNotes: "Carbon monoxide monitor in the enclosure; heater exhaust vented outside.", submitted: true,
      crew: [["Carpenters", 4], ["Laborers", 3]], equipment: [["Concrete bucket and crane", 1, 3], ["Indirect-fired heater", 1, 24]],
      delays: [], visitors: [] },
    { n: 0xb12, projectId: M, date: "2026-11-27", weatherSummary: "8 °C, overcast",
      workDone: "Placing the valve chamber walls.", safetyNotes: "", submitted: false,
      crew: [["Carpenters", 3], ["Laborers", 3]], equipment: [["Concrete pump 28 m", 1, 4]], delays: [], visitors: [["Kofi Mensah", "Millrace Water Board", "Owner's walk-through"]] },
  ];
  const diaryEntriesData: DemoRecord[] = diaries.map((d) => {
    const end = chicago(d.date, "17:30");
    return {
      projectId: d.projectId, by: sam, recordedAt: end,
      values: { id: demoId(d.n), date: d.date, weatherSummary: d.weatherSummary, workDone: d.workDone, safetyNotes: d.safetyNotes },
      extra: d.submitted ? { submittedAt: end, submittedBy: sam } : {},
    };
  });
  const diaryChild = (d: Diary, values: Record<string, unknown>): DemoRecord => ({
    projectId: d.projectId, by: sam, recordedAt: chicago(d.date, "17:00"), values: { id: demoId(++diaryChildN), diaryEntryId: demoId(d.n), ...values },
  });
  const crewData = diaries.flatMap((d) => d.crew.map(([trade, count]) => diaryChild(d, { trade, count })));
  const equipmentData = diaries.flatMap((d) => d.equipment.map(([name, count, hours]) => diaryChild(d, { name, count, hours })));
  const delaysData = diaries.flatMap((d) => d.delays.map(([cause, minutes, description]) => diaryChild(d, { cause, minutes, description })));
  const visitorsData = diaries.flatMap((d) => d.visitors.map(([name, company, purpose]) => diaryChild(d, { name, company, purpose })));

  return [
    ["mix-designs", mixes],
    ["placements", placementsData],
    ["deliveries", deliveriesData],
    ["field-tests", fieldTestsData],
    ["specimen-sets", specimenSetsData],
    ["breaks", breaksData],
    ["weather-observations", weatherData],
    ["checklists", checklistsData],
    ["checklist-items", checklistItemsData],
    ["curing-readings", curingData],
    ["diary-entries", diaryEntriesData],
    ["diary-crew", crewData],
    ["diary-equipment", equipmentData],
    ["diary-delays", delaysData],
    ["diary-visitors", visitorsData],
    ...maturityDemoRecords({ project: L, deck: P.deckL2, delivery: D.d3, sam, ines, olu }),
  ];
}
