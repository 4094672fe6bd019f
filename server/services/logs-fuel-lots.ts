/**
 * The fuel lot register of a vessel (bunker deliveries) and each lot's attachment (delivery note or lab report).
 * Attachments are checked by their first bytes (PDF, PNG, JPEG), stored under the upload folder as
 * <company>/<uuid> (never the user's file name), and served only through an authorised route.
 */
import { randomUUID } from 'node:crypto';
import { mkdir, readFile, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { and, asc, eq } from 'drizzle-orm';
import { fuelLotInputSchema, INTAKE_LIMITS, type FuelLotInput, type FuelLotRow } from '../../shared/schemas/logs';
import type { Actor, AppDeps } from '../context';
import type { DbOrTx } from '../db/client';
import { fuelLots } from '../db/schema';
import { AppError, notFound } from '../errors';
import { vesselForActor } from './access';
import { recordAudit } from './audit';
import { lotLcv } from './logs-derive';
import type { UploadedFile } from './logs-intake';

/** Folder of uploaded attachments (git-ignored): KILOWATCH_UPLOAD_DIR, parsed once in server/env.ts. */
export function uploadRoot(deps: AppDeps): string {
  return path.resolve(deps.config.uploadDir ?? path.join(process.cwd(), '.data', 'uploads'));
}

type LotRow = typeof fuelLots.$inferSelect;

function toLot(l: LotRow): FuelLotRow {
  return {
    id: l.id,
    vesselId: l.vesselId,
    reference: l.reference,
    grade: l.grade,
    density15KgPerM3: l.density15KgPerM3,
    lcvMjPerKg: l.lcvMjPerKg,
    lcvEstimated: l.lcvEstimated,
    sulphurPct: l.sulphurPct,
    quantityT: l.quantityT,
    deliveredOn: l.deliveredOn,
    attachment: l.attachmentPath && l.attachmentName && l.attachmentType ? { name: l.attachmentName, type: l.attachmentType, bytes: l.attachmentBytes ?? 0 } : null,
  };
}

export async function listFuelLots(deps: AppDeps, actor: Actor, vesselId: string): Promise<FuelLotRow[]> {
  await vesselForActor(deps.db, actor, vesselId);
  const rows = await deps.db.select().from(fuelLots).where(eq(fuelLots.vesselId, vesselId)).orderBy(asc(fuelLots.deliveredOn), asc(fuelLots.createdAt));
  return rows.map(toLot);
}

function lotValues(raw: FuelLotInput) {
  const input = fuelLotInputSchema.parse(raw);
  const lcv = lotLcv(input.grade, input.density15KgPerM3, input.sulphurPct, input.lcvMjPerKg);
  if (!lcv.ok) throw new AppError('validation_failed', lcv.issue.message, [lcv.issue]);
  return {
    reference: input.reference,
    grade: input.grade,
    density15KgPerM3: input.density15KgPerM3,
    lcvMjPerKg: lcv.lcvMjPerKg,
    lcvEstimated: lcv.estimated,
    sulphurPct: input.sulphurPct,
    quantityT: input.quantityT,
    deliveredOn: input.deliveredOn,
  };
}

async function lotOfVessel(db: DbOrTx, vesselId: string, lotId: string): Promise<LotRow> {
  const [lot] = await db.select().from(fuelLots).where(and(eq(fuelLots.id, lotId), eq(fuelLots.vesselId, vesselId)));
  if (!lot) throw notFound('Fuel lot');
  return lot;
}

async function checkReference(db: DbOrTx, vesselId: string, reference: string, lotId: string | null) {
  const same = await db.select({ id: fuelLots.id }).from(fuelLots).where(and(eq(fuelLots.vesselId, vesselId), eq(fuelLots.reference, reference)));
  if (same.some((s) => s.id !== lotId)) throw new AppError('conflict', `A lot called ${reference} is registered already`, [{ path: 'reference', message: 'Already used on this vessel' }]);
}

/** Adds a lot; a missing LCV is estimated from density and sulphur (ISO 8217 annex) and marked estimated. */
export async function createFuelLot(deps: AppDeps, actor: Actor, vesselId: string, raw: FuelLotInput): Promise<FuelLotRow> {
  const values = lotValues(raw);
  return deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    await checkReference(tx, vesselId, values.reference, null);
    const [row] = await tx.insert(fuelLots).values({ vesselId, ...values }).returning();
    await recordAudit(tx, actor, 'fuel_lot', row.id, 'create', null, row);
    return toLot(row);
  });
}

export async function updateFuelLot(deps: AppDeps, actor: Actor, vesselId: string, lotId: string, raw: FuelLotInput): Promise<FuelLotRow> {
  const values = lotValues(raw);
  return deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const before = await lotOfVessel(tx, vesselId, lotId);
    await checkReference(tx, vesselId, values.reference, lotId);
    const [after] = await tx.update(fuelLots).set(values).where(eq(fuelLots.id, lotId)).returning();
    await recordAudit(tx, actor, 'fuel_lot', lotId, 'update', before, after);
    return toLot(after);
  });
}

/** The attachment's media type from its first bytes; null for anything but PDF, PNG and JPEG. */
export function sniffAttachment(buf: Uint8Array): 'application/pdf' | 'image/png' | 'image/jpeg' | null {
  const at = (bytes: number[]) => buf.length >= bytes.length && bytes.every((b, i) => buf[i] === b);
  if (at([0x25, 0x50, 0x44, 0x46, 0x2d])) return 'application/pdf';
  if (at([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return 'image/png';
  if (at([0xff, 0xd8, 0xff])) return 'image/jpeg';
  return null;
}

const EXTENSIONS: Record<string, string[]> = { 'application/pdf': ['.pdf'], 'image/png': ['.png'], 'image/jpeg': ['.jpg', '.jpeg'] };

/** Stores (or replaces) a lot's attachment. Refuses other types by content and by extension, and oversize files. */
export async function putAttachment(deps: AppDeps, actor: Actor, vesselId: string, lotId: string, file: UploadedFile | undefined): Promise<FuelLotRow> {
  const vessel = await vesselForActor(deps.db, actor, vesselId);
  if (!file) throw new AppError('bad_request', 'Choose a PDF, PNG or JPEG file', [{ path: 'file', message: 'No file' }]);
  if (file.size > INTAKE_LIMITS.attachmentMaxBytes) throw new AppError('payload_too_large', 'The attachment is larger than the limit');
  const type = sniffAttachment(file.buffer);
  const ext = path.extname(file.originalname).toLowerCase();
  if (!type || !EXTENSIONS[type].includes(ext)) {
    throw new AppError('unsupported_media_type', 'Attach a PDF, PNG or JPEG file (its content and its name must agree)', [{ path: 'file', message: 'Not a PDF, PNG or JPEG' }]);
  }
  const relative = path.join(vessel.companyId, randomUUID());
  const absolute = path.join(uploadRoot(deps), relative);
  await mkdir(path.dirname(absolute), { recursive: true });
  await writeFile(absolute, file.buffer, { flag: 'wx' });
  const displayName = path.basename(file.originalname).replace(/[^\w.\- ]+/g, '_').slice(0, 120) || `attachment${ext}`;
  let oldPath: string | null = null;
  try {
    const result = await deps.db.transaction(async (tx) => {
      const before = await lotOfVessel(tx, vesselId, lotId);
      oldPath = before.attachmentPath;
      const [after] = await tx
        .update(fuelLots)
        .set({ attachmentPath: relative, attachmentName: displayName, attachmentType: type, attachmentBytes: file.size })
        .where(eq(fuelLots.id, lotId))
        .returning();
      await recordAudit(tx, actor, 'fuel_lot', lotId, 'attach', { attachmentName: before.attachmentName }, { attachmentName: displayName, attachmentType: type, bytes: file.size });
      return toLot(after);
    });
    if (oldPath) await rm(path.join(uploadRoot(deps), oldPath), { force: true });
    return result;
  } catch (err) {
    await rm(absolute, { force: true });
    throw err;
  }
}

/** The attachment's bytes for an authorised download. */
export async function getAttachment(deps: AppDeps, actor: Actor, vesselId: string, lotId: string): Promise<{ name: string; type: string; data: Buffer }> {
  await vesselForActor(deps.db, actor, vesselId);
  const lot = await lotOfVessel(deps.db, vesselId, lotId);
  if (!lot.attachmentPath || !lot.attachmentType) throw notFound('Attachment');
  const root = uploadRoot(deps);
  const absolute = path.resolve(root, lot.attachmentPath);
  if (!absolute.startsWith(root + path.sep)) throw notFound('Attachment');
  return { name: lot.attachmentName ?? 'attachment', type: lot.attachmentType, data: await readFile(absolute) };
}
