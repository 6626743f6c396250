import "server-only";
import { and, asc, desc, eq, lte } from "drizzle-orm";
import type { Db, DbOrTx } from "../client";
import { calibrations, columnMappings, instruments, type CalibrationRow, type InstrumentRow } from "../schema/instruments";
import { storedFiles } from "../schema/files";
import { recordAudit } from "./audit";
import type { Actor } from "@/lib/actor";
import { AppError, fromDbError, notFound } from "@/lib/errors";
import { CALIBRATION_DUE_SOON_DAYS, type CalibrationInput, type InstrumentInput } from "@/lib/validation/instruments";
import { storeContent } from "@/lib/storage/blob-store";
import { MAX_CERTIFICATE_BYTES, sniffCertificate } from "@/lib/uploads/file-type";

const DAY = 86_400_000;
const serialTaken = (serial: string) => () => `Another instrument of this kind already has the serial ${serial}.`;

export type CalibrationState = "valid" | "due_soon" | "lapsed" | "none";

/** The calibration state of an instrument at `at`, from its latest calibration performed by then. */
export function calibrationState(latest: Pick<CalibrationRow, "dueAt"> | null, at: Date): CalibrationState {
  if (!latest) return "none";
  if (latest.dueAt.getTime() < at.getTime()) return "lapsed";
  if (latest.dueAt.getTime() - at.getTime() <= CALIBRATION_DUE_SOON_DAYS * DAY) return "due_soon";
  return "valid";
}

export async function latestCalibrationAt(db: DbOrTx, instrumentId: number, at: Date) {
  const [row] = await db
    .select()
    .from(calibrations)
    .where(and(eq(calibrations.instrumentId, instrumentId), lte(calibrations.performedAt, at)))
    .orderBy(desc(calibrations.performedAt), desc(calibrations.id))
    .limit(1);
  return row ?? null;
}

export async function listInstruments(db: DbOrTx, now = new Date()) {
  const rows = await db.select().from(instruments).orderBy(asc(instruments.kind), asc(instruments.name));
  return Promise.all(
    rows.map(async (instrument) => {
      const latest = await latestCalibrationAt(db, instrument.id, now);
      return { instrument, latest, state: calibrationState(latest, now) };
    }),
  );
}
export type InstrumentListRow = Awaited<ReturnType<typeof listInstruments>>[number];

export async function getInstrument(db: DbOrTx, id: number) {
  const [row] = await db.select().from(instruments).where(eq(instruments.id, id)).limit(1);
  return row ?? null;
}

export async function listCalibrations(db: DbOrTx, instrumentId: number) {
  return db.select().from(calibrations).where(eq(calibrations.instrumentId, instrumentId)).orderBy(desc(calibrations.performedAt));
}

export async function createInstrument(db: Db, input: InstrumentInput, actor: Actor | null): Promise<InstrumentRow> {
  try {
    return await db.transaction(async (tx) => {
      const [created] = await tx.insert(instruments).values(input).returning();
      await recordAudit(tx, { actor, action: "instrument.create", entity: "instrument", entityId: created.id, after: created });
      return created;
    });
  } catch (err) {
    throw fromDbError(err, serialTaken(input.serial)) ?? err;
  }
}

export async function updateInstrument(db: Db, id: number, patch: Partial<InstrumentInput>, actor: Actor): Promise<InstrumentRow> {
  try {
    return await db.transaction(async (tx) => {
      const before = await getInstrument(tx, id);
      if (!before) throw notFound("That instrument");
      const [after] = await tx.update(instruments).set({ ...patch, updatedAt: new Date() }).where(eq(instruments.id, id)).returning();
      await recordAudit(tx, { actor, action: "instrument.update", entity: "instrument", entityId: id, before, after });
      return after;
    });
  } catch (err) {
    throw fromDbError(err, serialTaken(patch.serial ?? "")) ?? err;
  }
}

/** Records a calibration; a certificate must be a PDF, PNG or JPEG (by its bytes) of at most 10 MB. */
export async function createCalibration(
  db: Db,
  instrumentId: number,
  input: CalibrationInput,
  actor: Actor | null,
  certificate?: { bytes: Uint8Array } | null,
): Promise<CalibrationRow> {
  const instrument = await getInstrument(db, instrumentId);
  if (!instrument) throw notFound("That instrument");
  for (const key of Object.keys(input.offsets)) {
    const ch = Number(key);
    if (ch < 1 || ch > instrument.channelCount) throw new AppError("invalid_input", `offsets: channel ${key} does not exist on a ${instrument.channelCount}-channel instrument.`, { fields: { offsets: `channel ${key} does not exist` } });
  }
  let cert: { sha256: string; path: string; mediaType: string; size: number } | null = null;
  if (certificate && certificate.bytes.length > 0) {
    if (certificate.bytes.length > MAX_CERTIFICATE_BYTES) throw new AppError("file_too_large", "The certificate is larger than 10 MB.", { fields: { certificate: "at most 10 MB" } });
    const mediaType = sniffCertificate(certificate.bytes);
    if (!mediaType) throw new AppError("unsupported_file", "The certificate must be a PDF, PNG or JPEG file.", { fields: { certificate: "a PDF, PNG or JPEG file" } });
    const written = await storeContent(certificate.bytes);
    cert = { sha256: written.sha256, path: written.path, mediaType, size: certificate.bytes.length };
  }
  const dueAt = input.dueAt ?? new Date(input.performedAt.getTime() + 365 * DAY);
  return db.transaction(async (tx) => {
    if (cert) await tx.insert(storedFiles).values(cert).onConflictDoUpdate({ target: storedFiles.sha256, set: { purgedAt: null } });
    const [created] = await tx
      .insert(calibrations)
      .values({ instrumentId, performedAt: input.performedAt, performedBy: input.performedBy, reference: input.reference, offsets: input.offsets, expandedUncertainty: input.expandedUncertainty ?? null, certificateSha256: cert?.sha256 ?? null, dueAt, createdBy: actor?.userId ?? null })
      .returning();
    await recordAudit(tx, { actor, action: "calibration.create", entity: "calibration", entityId: created.id, after: created });
    return created;
  });
}

export async function getRememberedMapping(db: DbOrTx, instrumentId: number, boardId: number) {
  const [row] = await db.select().from(columnMappings).where(and(eq(columnMappings.instrumentId, instrumentId), eq(columnMappings.boardId, boardId))).limit(1);
  return row?.mapping ?? null;
}

export async function rememberMapping(tx: DbOrTx, instrumentId: number, boardId: number, mapping: Record<string, string>) {
  await tx
    .insert(columnMappings)
    .values({ instrumentId, boardId, mapping })
    .onConflictDoUpdate({ target: [columnMappings.instrumentId, columnMappings.boardId], set: { mapping, updatedAt: new Date() } });
}

export function instrumentJson(i: InstrumentRow, latest?: CalibrationRow | null, state?: CalibrationState) {
  return {
    id: i.id, kind: i.kind, name: i.name, serial: i.serial, channelCount: i.channelCount, scanSkewSeconds: i.scanSkewSeconds,
    resolution: i.resolution, accuracy: i.accuracy, thermocoupleType: i.thermocoupleType, toleranceClass: i.toleranceClass, notes: i.notes,
    calibration: latest === undefined ? undefined : { state: state ?? "none", latest: latest ? calibrationJson(latest) : null },
  };
}

export function calibrationJson(c: CalibrationRow) {
  return {
    id: c.id, instrumentId: c.instrumentId, performedAt: c.performedAt.toISOString(), performedBy: c.performedBy, reference: c.reference,
    offsets: c.offsets, expandedUncertainty: c.expandedUncertainty, certificate: c.certificateSha256 !== null, dueAt: c.dueAt.toISOString(),
  };
}
