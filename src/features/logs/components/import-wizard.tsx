import { useState } from 'react';
import { DATE_FORMATS, FIELD_LABELS, FIELD_UNITS, LOG_FIELDS, type ColumnMapping, type LogField, type Preview } from '../../../../shared/schemas/logs';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Field, Input, Select } from '../../../components/ui/form-field';
import { Table, Td, Th } from '../../../components/ui/table';
import { errorMessage, isApiError } from '../../../lib/api-client';
import { formatSfoc } from '../../../lib/format';
import { useCommitUpload, type CommitResult } from '../api/commit-upload';
import { templateUrl } from '../api/get-logs';
import { usePreviewUpload } from '../api/preview-upload';

const STATUS_TONE = { new: 'good', changed: 'accent', unchanged: 'neutral', error: 'bad' } as const;

/** Upload → mapping → preview (nothing stored) → confirm; large files show upload progress, then a parsing note. */
export function ImportWizard({ vesselId }: { vesselId: string }) {
  const [file, setFile] = useState<File | null>(null);
  const [mapping, setMapping] = useState<ColumnMapping | undefined>(undefined);
  const [preview, setPreview] = useState<Preview | null>(null);
  const [progress, setProgress] = useState<number | null>(null);
  const [overwrite, setOverwrite] = useState(false);
  const [done, setDone] = useState<CommitResult | null>(null);
  const previewing = usePreviewUpload();
  const committing = useCommitUpload(vesselId);
  const busy = previewing.isPending || committing.isPending;

  const runPreview = (f: File, m?: ColumnMapping) => {
    setDone(null);
    setProgress(0);
    previewing.mutate(
      { vesselId, file: f, mapping: m, onProgress: setProgress },
      {
        onSuccess: (p) => {
          setPreview(p);
          setMapping(p.mapping);
          setProgress(null);
        },
        onError: () => setProgress(null),
      },
    );
  };
  const setColumn = (header: string, patch: Partial<ColumnMapping['columns'][string]>) => {
    if (!mapping) return;
    const next = { ...mapping.columns[header], ...patch };
    if (patch.field) {
      const units = (FIELD_UNITS as Record<string, readonly string[]>)[patch.field];
      next.unit = units ? (units[0] as typeof next.unit) : undefined;
    }
    setMapping({ ...mapping, columns: { ...mapping.columns, [header]: next } });
  };
  const commit = () => {
    if (!file || !preview || !mapping) return;
    setProgress(0);
    committing.mutate(
      { vesselId, file, options: { mapping, overwriteChanged: overwrite, fileSha256: preview.fileSha256 }, onProgress: setProgress },
      { onSuccess: (r) => { setDone(r); setPreview(null); setProgress(null); }, onError: () => setProgress(null) },
    );
  };
  const error = previewing.error ?? committing.error;
  const ambiguous = isApiError(error) && error.fieldIssues.some((i) => i.path === 'dateFormat');
  const headers = preview?.headers ?? [];
  const shown = preview ? [...preview.rows].sort((a, b) => Number(b.status === 'error') - Number(a.status === 'error') || a.row - b.row).slice(0, 300) : [];

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end gap-3">
        <Field label="CSV file (UTF-8; comma, semicolon or tab; up to 20 MB)" htmlFor="imp-file">
          <Input
            id="imp-file"
            type="file"
            accept=".csv,.tsv,.txt,text/csv"
            onChange={(e) => {
              const f = e.target.files?.[0] ?? null;
              setFile(f);
              setPreview(null);
              setMapping(undefined);
              if (f) runPreview(f);
            }}
          />
        </Field>
        <a className="text-small font-semibold underline" href={templateUrl(vesselId)}>Download the CSV template</a>
      </div>
      {progress !== null ? (
        <p className="text-small" role="status">
          {progress < 1 ? `Uploading… ${Math.round(progress * 100)} %` : 'Uploaded; the server is reading and checking every row…'}
        </p>
      ) : null}
      {error ? <Alert tone="error">{errorMessage(error)}{isApiError(error) && error.fieldIssues.length > 1 ? ` (${error.fieldIssues.slice(1, 6).map((i) => `${i.row ? `row ${i.row}, ` : ''}${i.path}: ${i.message}`).join('; ')})` : ''}</Alert> : null}
      {ambiguous && file ? (
        <Field label="The dates are ambiguous: choose their format" htmlFor="imp-datefmt">
          <Select id="imp-datefmt" defaultValue="" onChange={(e) => e.target.value && runPreview(file, { ...(mapping ?? { columns: {} }), ...(mapping ? {} : {}), dateFormat: e.target.value as ColumnMapping['dateFormat'] } as ColumnMapping)}>
            <option value="">Choose…</option>
            {DATE_FORMATS.map((f) => <option key={f} value={f}>{f}</option>)}
          </Select>
        </Field>
      ) : null}
      {done ? (
        <Alert tone="success">
          Imported: {done.rowsNew} new, {done.rowsChanged} overwritten, {done.rowsUnchanged} unchanged, {done.rowsRejected} rejected
          {done.rowsChangedSkipped ? `, ${done.rowsChangedSkipped} changed rows left as stored` : ''}; {done.modeDaysWritten} mode-hour days. Undo it from the import history.
        </Alert>
      ) : null}
      {preview && mapping ? (
        <>
          <Table caption="Column mapping">
            <thead>
              <tr><Th>Column in the file</Th><Th>Holds</Th><Th>Unit</Th><Th>Set (wide files)</Th></tr>
            </thead>
            <tbody>
              {headers.map((h) => {
                const entry = mapping.columns[h] ?? { field: 'ignore' as LogField };
                const units = (FIELD_UNITS as Record<string, readonly string[]>)[entry.field];
                return (
                  <tr key={h}>
                    <Td>{h}</Td>
                    <Td>
                      <Select aria-label={`Field of ${h}`} value={entry.field} onChange={(e) => setColumn(h, { field: e.target.value as LogField })}>
                        {LOG_FIELDS.map((f) => <option key={f} value={f}>{FIELD_LABELS[f]}</option>)}
                      </Select>
                    </Td>
                    <Td>
                      {units ? (
                        <Select aria-label={`Unit of ${h}`} value={entry.unit ?? units[0]} onChange={(e) => setColumn(h, { unit: e.target.value as typeof entry.unit })}>
                          {units.map((u) => <option key={u} value={u}>{u}</option>)}
                        </Select>
                      ) : '–'}
                    </Td>
                    <Td>
                      <Input aria-label={`Set of ${h}`} value={entry.genset ?? ''} onChange={(e) => setColumn(h, { genset: e.target.value || undefined })} />
                    </Td>
                  </tr>
                );
              })}
            </tbody>
          </Table>
          <div className="flex flex-wrap items-end gap-3">
            <Field label="Date format" htmlFor="imp-df">
              <Select id="imp-df" value={mapping.dateFormat ?? ''} onChange={(e) => setMapping({ ...mapping, dateFormat: e.target.value as ColumnMapping['dateFormat'] })}>
                {DATE_FORMATS.map((f) => <option key={f} value={f}>{f}</option>)}
              </Select>
            </Field>
            <Field label="Decimal separator" htmlFor="imp-dec">
              <Select id="imp-dec" value={mapping.decimalSeparator ?? '.'} onChange={(e) => setMapping({ ...mapping, decimalSeparator: e.target.value as '.' | ',' })}>
                <option value=".">point (12.5)</option>
                <option value=",">comma (12,5)</option>
              </Select>
            </Field>
            <Button variant="secondary" disabled={!file || busy} onClick={() => file && runPreview(file, mapping)}>Preview again with this mapping</Button>
          </div>
          <p className="text-small">
            Mapping {preview.mappingSource === 'saved' ? 'saved for this vessel last time' : preview.mappingSource === 'guessed' ? 'guessed from the headers: check every column' : 'as chosen'} ·
            {' '}{preview.counts.total} rows: <Badge tone="good">{preview.counts.new} new</Badge> <Badge tone="accent">{preview.counts.changed} changed</Badge>{' '}
            <Badge tone="neutral">{preview.counts.unchanged} unchanged</Badge> <Badge tone="bad">{preview.counts.rejected} with errors (not imported)</Badge>
            {preview.modeDays.length ? ` · ${preview.modeDays.length} mode-hour days` : ''}
          </p>
          <Table caption="Preview of the rows (errors first, at most 300 shown)">
            <thead>
              <tr><Th>Row</Th><Th>Set</Th><Th>Date</Th><Th>Status</Th><Th numeric>Hours run</Th><Th numeric>Energy</Th><Th numeric>SFOC ISO</Th><Th>Errors and flags</Th></tr>
            </thead>
            <tbody>
              {shown.map((r) => (
                <tr key={`${r.row}-${r.designation}`}>
                  <Td numeric>{r.row}</Td>
                  <Td>{r.designation ?? '–'}</Td>
                  <Td>{r.logDate ?? '–'}</Td>
                  <Td><Badge tone={STATUS_TONE[r.status]}>{r.status}</Badge></Td>
                  <Td numeric>{r.derived?.hoursRun === null || !r.derived ? '–' : `${r.derived.hoursRun.toFixed(1)}\u00a0h`}</Td>
                  <Td numeric>{r.derived?.kwh === null || !r.derived ? '–' : `${r.derived.kwh.toFixed(0)}\u00a0kWh`}</Td>
                  <Td numeric>{formatSfoc(r.derived?.sfocIsoGPerKwh ?? null)}</Td>
                  <Td>
                    {r.errors.map((e) => <div key={e.path + e.message} className="text-danger-700">{e.path}: {e.message}</div>)}
                    {r.status === 'changed' && r.before ? <div>Stored values would be overwritten.</div> : null}
                    {r.flags.map((f) => <span key={f.code} title={f.message}><Badge tone={f.severity === 'error' ? 'bad' : 'accent'}>{f.code}</Badge> </span>)}
                  </Td>
                </tr>
              ))}
            </tbody>
          </Table>
          <div className="flex flex-wrap items-center gap-3">
            {preview.counts.changed ? (
              <label className="flex items-center gap-2 text-small">
                <input type="checkbox" checked={overwrite} onChange={(e) => setOverwrite(e.target.checked)} />
                Overwrite the {preview.counts.changed} changed day(s) with the file's values
              </label>
            ) : null}
            <Button onClick={commit} pending={committing.isPending} pendingLabel="Importing…" disabled={busy}>
              {(() => {
                const n = preview.counts.new + (overwrite ? preview.counts.changed : 0);
                return `Import ${n} ${n === 1 ? 'row' : 'rows'}`;
              })()}
            </Button>
          </div>
        </>
      ) : null}
    </div>
  );
}
