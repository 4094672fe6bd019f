import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { fuelLotInputSchema, INTAKE_LIMITS, type FuelLotRow } from '../../../../shared/schemas/logs';
import { FUEL_GRADES } from '../../../../shared/schemas/vessels';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { FormActions } from '../../../components/ui/form-actions';
import { Field, Input, Select } from '../../../components/ui/form-field';
import { QueryView } from '../../../components/ui/states';
import { Table, Td, Th } from '../../../components/ui/table';
import { errorMessage } from '../../../lib/api-client';
import { formatDate } from '../../../lib/format';
import { useServerErrors } from '../../../lib/form-errors';
import { toNumber, toNumberOrNull } from '../../../lib/number-fields';
import { attachmentUrl, useFuelLots } from '../api/get-fuel-lots';
import { useSaveFuelLot } from '../api/save-fuel-lot';
import { useUploadAttachment } from '../api/upload-attachment';

const FIELDS = ['reference', 'grade', 'density15KgPerM3', 'lcvMjPerKg', 'sulphurPct', 'quantityT', 'deliveredOn'] as const;

function FuelLotForm({ vesselId, lot, onDone }: { vesselId: string; lot?: FuelLotRow; onDone: () => void }) {
  const form = useForm<z.input<typeof fuelLotInputSchema>, unknown, z.output<typeof fuelLotInputSchema>>({
    resolver: zodResolver(fuelLotInputSchema),
    defaultValues: lot
      ? { reference: lot.reference, grade: lot.grade as (typeof FUEL_GRADES)[number], density15KgPerM3: lot.density15KgPerM3, lcvMjPerKg: lot.lcvEstimated ? null : lot.lcvMjPerKg, sulphurPct: lot.sulphurPct, quantityT: lot.quantityT, deliveredOn: lot.deliveredOn }
      : { grade: 'MGO', lcvMjPerKg: null, sulphurPct: null, quantityT: null, deliveredOn: new Date().toISOString().slice(0, 10) },
  });
  const save = useSaveFuelLot(vesselId);
  const server = useServerErrors(form.setError, FIELDS);
  const e = form.formState.errors;
  return (
    <form noValidate className="grid gap-3 md:grid-cols-4" onSubmit={form.handleSubmit((input) => { server.clear(); save.mutate({ vesselId, lotId: lot?.id, input }, { onSuccess: onDone, onError: server.onError }); })}>
      {server.problem ? <div className="md:col-span-4"><Alert tone="error">{server.problem}</Alert></div> : null}
      <Field label="Reference (delivery note no.)" htmlFor="fl-ref" error={e.reference?.message}><Input id="fl-ref" {...form.register('reference')} /></Field>
      <Field label="Grade" htmlFor="fl-grade" error={e.grade?.message}>
        <Select id="fl-grade" {...form.register('grade')}>{FUEL_GRADES.map((g) => <option key={g} value={g}>{g}</option>)}</Select>
      </Field>
      <Field label="Density at 15 °C" htmlFor="fl-rho" error={e.density15KgPerM3?.message}><Input id="fl-rho" inputMode="decimal" unit="kg/m³" {...form.register('density15KgPerM3', { setValueAs: toNumber })} /></Field>
      <Field label="LCV (lab report)" htmlFor="fl-lcv" error={e.lcvMjPerKg?.message} hint="Empty: estimated from density and sulphur (ISO 8217 annex), marked estimated"><Input id="fl-lcv" inputMode="decimal" unit="MJ/kg" {...form.register('lcvMjPerKg', { setValueAs: toNumberOrNull })} /></Field>
      <Field label="Sulphur" htmlFor="fl-s" error={e.sulphurPct?.message}><Input id="fl-s" inputMode="decimal" unit="% m/m" {...form.register('sulphurPct', { setValueAs: toNumberOrNull })} /></Field>
      <Field label="Quantity" htmlFor="fl-q" error={e.quantityT?.message}><Input id="fl-q" inputMode="decimal" unit="t" {...form.register('quantityT', { setValueAs: toNumberOrNull })} /></Field>
      <Field label="Delivered on" htmlFor="fl-date" error={e.deliveredOn?.message}><Input id="fl-date" type="date" {...form.register('deliveredOn')} /></Field>
      <div className="md:col-span-4"><FormActions submitLabel={lot ? 'Save lot' : 'Add lot'} pending={save.isPending} onCancel={onDone} /></div>
    </form>
  );
}

/** The vessel's bunker lots with their delivery note or lab report. */
export function FuelLotRegister({ vesselId, mayEdit }: { vesselId: string; mayEdit: boolean }) {
  const lots = useFuelLots(vesselId);
  const upload = useUploadAttachment(vesselId);
  const [editing, setEditing] = useState<FuelLotRow | 'new' | null>(null);
  return (
    <div className="space-y-3">
      {mayEdit && editing === null ? <Button onClick={() => setEditing('new')}>Add a fuel lot</Button> : null}
      {editing ? <FuelLotForm vesselId={vesselId} lot={editing === 'new' ? undefined : editing} onDone={() => setEditing(null)} /> : null}
      {upload.error ? <Alert tone="error">{errorMessage(upload.error)}</Alert> : null}
      <QueryView query={lots} isEmpty={(d) => d.length === 0} empty={<p className="text-small text-hull-600">No fuel lots yet. Add each bunker delivery so logged fuel can be corrected.</p>}>
        {(rows) => (
          <Table caption="Fuel lots">
            <thead>
              <tr><Th>Delivered</Th><Th>Reference</Th><Th>Grade</Th><Th numeric>Density 15 °C</Th><Th numeric>LCV</Th><Th numeric>Sulphur</Th><Th numeric>Quantity</Th><Th>Document</Th><Th /></tr>
            </thead>
            <tbody>
              {rows.map((l) => (
                <tr key={l.id}>
                  <Td>{formatDate(l.deliveredOn)}</Td>
                  <Td>{l.reference}</Td>
                  <Td>{l.grade}</Td>
                  <Td numeric>{l.density15KgPerM3.toFixed(1)}&nbsp;kg/m³</Td>
                  <Td numeric>{l.lcvMjPerKg.toFixed(3)}&nbsp;MJ/kg {l.lcvEstimated ? <Badge tone="accent">estimated</Badge> : null}</Td>
                  <Td numeric>{l.sulphurPct === null ? '–' : `${l.sulphurPct.toFixed(2)}\u00a0%`}</Td>
                  <Td numeric>{l.quantityT === null ? '–' : `${l.quantityT.toLocaleString('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 1 })}\u00a0t`}</Td>
                  <Td>
                    {l.attachment ? <a className="underline" href={attachmentUrl(vesselId, l.id)}>{l.attachment.name} ({Math.ceil(l.attachment.bytes / 1024)} kB)</a> : '–'}
                    {mayEdit ? (
                      <label className="ml-2 cursor-pointer text-small underline">
                        {l.attachment ? 'replace' : 'attach PDF/PNG/JPEG'}
                        <input
                          type="file"
                          className="sr-only"
                          accept="application/pdf,image/png,image/jpeg"
                          onChange={(e) => {
                            const file = e.target.files?.[0];
                            if (!file) return;
                            if (file.size > INTAKE_LIMITS.attachmentMaxBytes) return window.alert('The file is larger than 10 MB.');
                            upload.mutate({ vesselId, lotId: l.id, file });
                          }}
                        />
                      </label>
                    ) : null}
                  </Td>
                  <Td>{mayEdit ? <Button size="sm" variant="secondary" onClick={() => setEditing(l)}>Edit</Button> : null}</Td>
                </tr>
              ))}
            </tbody>
          </Table>
        )}
      </QueryView>
    </div>
  );
}
