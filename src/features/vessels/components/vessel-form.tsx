import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { FUEL_GRADES, VESSEL_TYPES, vesselInputSchema, type VesselDetail, type VesselInput } from '../../../../shared/schemas/vessels';
import { Alert } from '../../../components/ui/alert';
import { FormActions } from '../../../components/ui/form-actions';
import { Field, Input, Select } from '../../../components/ui/form-field';
import { useServerErrors } from '../../../lib/form-errors';
import { useCreateVessel } from '../api/create-vessel';
import { useUpdateVessel } from '../api/update-vessel';

const FIELD_NAMES = ['name', 'imoNumber', 'vesselType', 'fuelGrades', 'busSections'] as const;

const splitSections = (value: unknown): string[] =>
  Array.isArray(value)
    ? value
    : String(value ?? '')
        .split(',')
        .map((s) => s.trim())
        .filter((s) => s.length > 0);

interface VesselFormProps {
  /** The vessel to edit; absent when adding one. Bus sections of an existing vessel are added one by one elsewhere. */
  vessel?: VesselDetail;
  onDone: (vesselId: string) => void;
  onCancel: () => void;
}

export function VesselForm({ vessel, onDone, onCancel }: VesselFormProps) {
  const create = useCreateVessel();
  const update = useUpdateVessel();
  const mutation = vessel ? update : create;
  const form = useForm<VesselInput, unknown, z.output<typeof vesselInputSchema>>({
    resolver: zodResolver(vesselInputSchema),
    defaultValues: vessel
      ? {
          name: vessel.name,
          imoNumber: vessel.imoNumber,
          vesselType: VESSEL_TYPES.find((t) => t === vessel.vesselType) ?? VESSEL_TYPES[0],
          fuelGrades: vessel.fuelGrades.filter((g): g is (typeof FUEL_GRADES)[number] => (FUEL_GRADES as readonly string[]).includes(g)),
          busSections: vessel.busSections.map((s) => s.name),
        }
      : { name: '', imoNumber: '', vesselType: VESSEL_TYPES[0], fuelGrades: [], busSections: ['A'] },
  });
  const { errors } = form.formState;
  const server = useServerErrors(form.setError, FIELD_NAMES);

  const submit = form.handleSubmit(({ busSections, ...fields }) => {
    server.clear();
    if (vessel) update.mutate({ vesselId: vessel.id, changes: fields }, { onSuccess: () => onDone(vessel.id), onError: server.onError });
    else create.mutate({ ...fields, busSections }, { onSuccess: (created) => onDone(created.id), onError: server.onError });
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label={vessel ? `Edit ${vessel.name}` : 'Add a vessel'} data-form="vessel">
      {server.problem ? <Alert tone="error">{server.problem}</Alert> : null}
      <div className="grid gap-4 sm:grid-cols-3">
        <Field label="Vessel name" htmlFor="vessel-name" error={errors.name?.message}>
          <Input id="vessel-name" invalid={!!errors.name} {...form.register('name')} />
        </Field>
        <Field label="IMO number" htmlFor="vessel-imo" error={errors.imoNumber?.message} hint="Seven digits">
          <Input id="vessel-imo" inputMode="numeric" invalid={!!errors.imoNumber} {...form.register('imoNumber')} />
        </Field>
        <Field label="Type" htmlFor="vessel-type" error={errors.vesselType?.message}>
          <Select id="vessel-type" {...form.register('vesselType')}>
            {VESSEL_TYPES.map((t) => (
              <option key={t} value={t}>
                {t}
              </option>
            ))}
          </Select>
        </Field>
      </div>
      <fieldset aria-describedby={errors.fuelGrades ? 'vessel-fuel-error' : undefined}>
        <legend className="mb-1 text-small font-semibold text-hull-800">Fuel grades burnt in the gensets</legend>
        <div className="flex flex-wrap gap-4">
          {FUEL_GRADES.map((g) => (
            <label key={g} className="inline-flex items-center gap-2 text-body">
              <input type="checkbox" value={g} className="h-4 w-4 accent-brass-500" {...form.register('fuelGrades')} />
              {g}
            </label>
          ))}
        </div>
        {errors.fuelGrades ? (
          <p id="vessel-fuel-error" role="alert" className="mt-1 text-caption font-semibold text-signal-600">
            {errors.fuelGrades.message}
          </p>
        ) : null}
      </fieldset>
      {vessel ? null : (
        <Field label="Bus sections" htmlFor="vessel-sections" error={errors.busSections?.message} hint="Names separated by commas, such as A, B (at most 4)">
          <Input id="vessel-sections" invalid={!!errors.busSections} {...form.register('busSections', { setValueAs: splitSections })} />
        </Field>
      )}
      <FormActions submitLabel={vessel ? 'Save changes' : 'Add vessel'} pending={mutation.isPending} onCancel={onCancel} />
    </form>
  );
}
