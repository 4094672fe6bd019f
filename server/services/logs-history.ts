/**
 * Import history and undo. Undo removes exactly the rows an import created and restores the values it overwrote.
 * It is refused (409, naming the rows) when any of those rows was overwritten afterwards by another (still committed)
 * import, edited by hand, or (an overwritten row) deleted: restoring them would silently drop the later change.
 * Undo the later import first. Rows the import created are found by their import_id; only overwritten rows have a
 * change record with their before values.
 */
import { and, desc, eq, sql } from 'drizzle-orm';
import type { LogImport, ModeField } from '../../shared/schemas/logs';
import type { Actor, AppDeps } from '../context';
import { auditLog, gensets, logImportChanges, logImports, users, vesselModeHours } from '../db/schema';
import { AppError, notFound } from '../errors';
import { vesselForActor } from './access';
import { recordAudit } from './audit';
import type { RowBefore } from './logs-intake';
import { upsertModeHours } from './logs-intake';

export async function listImports(deps: AppDeps, actor: Actor, vesselId: string): Promise<LogImport[]> {
  await vesselForActor(deps.db, actor, vesselId);
  const rows = await deps.db
    .select({ imp: logImports, userName: users.name })
    .from(logImports)
    .leftJoin(users, eq(users.id, logImports.userId))
    .where(eq(logImports.vesselId, vesselId))
    .orderBy(desc(logImports.createdAt));
  return rows.map(({ imp, userName }) => ({
    id: imp.id,
    fileName: imp.fileName,
    fileSha256: imp.fileSha256,
    userName,
    createdAt: imp.createdAt.toISOString(),
    rowsNew: imp.rowsNew,
    rowsChanged: imp.rowsChanged,
    rowsUnchanged: imp.rowsUnchanged,
    rowsRejected: imp.rowsRejected,
    status: imp.status,
    undoneAt: imp.undoneAt?.toISOString() ?? null,
  }));
}

const BATCH = 10_000;

export async function undoImport(deps: AppDeps, actor: Actor, vesselId: string, importId: string): Promise<{ rowsRemoved: number; rowsRestored: number }> {
  return deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const [imp] = await tx
      .select()
      .from(logImports)
      .where(and(eq(logImports.id, importId), eq(logImports.vesselId, vesselId)))
      .for('update');
    if (!imp) throw notFound('Import');
    if (imp.status === 'undone') throw new AppError('conflict', 'This import has been undone already');
    // Rows the import overwrote (its change records) beside the row as it is now.
    const overwrittenNow = await tx.execute<{ genset_id: string; log_date: string; before: RowBefore; row_id: string | null; import_id: string | null; source: string | null; designation: string }>(sql`
      select c.genset_id, c.log_date::text as log_date, c.before, l.id as row_id, l.import_id, l.source, g.designation
      from ${logImportChanges} c
      join ${gensets} g on g.id = c.genset_id
      left join genset_daily_logs l on l.genset_id = c.genset_id and l.log_date = c.log_date
      where c.import_id = ${importId}`);
    // Rows still carrying the import: created by it (no change record) or overwritten by it; 'manual' = edited since.
    const carrying = await tx.execute<{ genset_id: string; log_date: string; source: string; designation: string }>(sql`
      select l.genset_id, l.log_date::text as log_date, l.source, g.designation
      from genset_daily_logs l join ${gensets} g on g.id = l.genset_id
      where l.import_id = ${importId}`);
    // Rows of this import that a later, still committed import overwrote.
    const laterImports = await tx.execute<{ genset_id: string; log_date: string; designation: string }>(sql`
      select c.genset_id, c.log_date::text as log_date, g.designation
      from ${logImportChanges} c
      join ${logImports} i on i.id = c.import_id and i.status = 'committed'
      join ${gensets} g on g.id = c.genset_id
      where c.import_id <> ${importId} and c.before->>'importId' = ${importId}`);
    const conflicts = [
      ...laterImports.rows.map((c) => ({ path: `${c.designation} ${c.log_date}`, message: 'Overwritten by a later import' })),
      ...carrying.rows.filter((c) => c.source !== 'import').map((c) => ({ path: `${c.designation} ${c.log_date}`, message: 'Edited by hand after this import' })),
      ...overwrittenNow.rows.filter((c) => c.row_id === null).map((c) => ({ path: `${c.designation} ${c.log_date}`, message: 'Deleted after this import' })),
    ];
    if (conflicts.length) {
      throw new AppError(
        'conflict',
        `${conflicts.length} row(s) of this import were changed or deleted afterwards (first: ${conflicts[0].path}); undo the later import or edit those days by hand`,
        conflicts.slice(0, 50),
      );
    }
    const overwritten = overwrittenNow.rows;
    const overwrittenKeys = new Set(overwritten.map((c) => `${c.genset_id}|${c.log_date}`));
    const created = carrying.rows.filter((c) => !overwrittenKeys.has(`${c.genset_id}|${c.log_date}`));
    for (let i = 0; i < created.length; i += BATCH) {
      const json = JSON.stringify(created.slice(i, i + BATCH).map((c) => ({ g: c.genset_id, d: c.log_date })));
      await tx.execute(sql`
        delete from genset_daily_logs l using json_to_recordset(${json}::json) as x(g uuid, d date)
        where l.genset_id = x.g and l.log_date = x.d and l.import_id = ${importId}::uuid`);
    }
    for (let i = 0; i < overwritten.length; i += BATCH) {
      const json = JSON.stringify(overwritten.slice(i, i + BATCH).map((c) => ({ g: c.genset_id, d: c.log_date, ...c.before })));
      await tx.execute(sql`
        update genset_daily_logs l set
          running_hours_meter = x."runningHoursMeter", hours_run = x."hoursRun", kwh_meter = x."kwhMeter", kwh = x.kwh,
          fuel_mass_kg = x."fuelMassKg", fuel_volume_l = x."fuelVolumeL", fuel_temp_c = x."fuelTempC",
          fuel_lot_id = x."fuelLotId", remarks = x.remarks, source = x.source, import_id = x."importId", updated_at = now()
        from json_to_recordset(${json}::json) as x(g uuid, d date, "runningHoursMeter" float8, "hoursRun" float8, "kwhMeter" float8,
          kwh float8, "fuelMassKg" float8, "fuelVolumeL" float8, "fuelTempC" float8, "fuelLotId" uuid, remarks text, source text, "importId" uuid)
        where l.genset_id = x.g and l.log_date = x.d and l.import_id = ${importId}::uuid`);
    }
    // Mode hours the import wrote: restore from its audit record.
    const [modeAudit] = await tx
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entity, 'vessel_mode_hours_import'), eq(auditLog.entityId, importId)));
    if (modeAudit) {
      const befores = modeAudit.before as { logDate: string; before: Record<ModeField, number> | null }[];
      const gone = befores.filter((b) => b.before === null).map((b) => b.logDate);
      if (gone.length) {
        await tx.execute(sql`delete from ${vesselModeHours} where vessel_id = ${vesselId} and log_date = any(${`{${gone.join(',')}}`}::date[])`);
      }
      const restore = befores.filter((b) => b.before !== null).map((b) => ({ logDate: b.logDate, ...(b.before as Record<ModeField, number>) }));
      if (restore.length) await upsertModeHours(tx, vesselId, restore);
    }
    await tx.update(logImports).set({ status: 'undone', undoneAt: deps.now(), undoneBy: actor.userId }).where(eq(logImports.id, importId));
    const result = { rowsRemoved: created.length, rowsRestored: overwritten.length };
    await recordAudit(tx, actor, 'log_import', importId, 'undo', { status: 'committed' }, { status: 'undone', ...result });
    return result;
  });
}
