import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, type DefaultValues } from 'react-hook-form';
import type { z } from 'zod';
import { gensetInputSchema, type Genset, type GensetInput } from '../../../../shared/schemas/vessels';
import { Alert } from '../../../components/ui/alert';
import { FormActions } from '../../../components/ui/form-actions';
import { Field, Input, Select } from '../../../components/ui/form-field';
import { useServerErrors } from '../../../lib/form-errors';
import { numberFieldMessages, toNumber, toNumberOrNull } from '../../../lib/number-fields';
import { useCreateGenset } from '../api/create-genset';
import { useUpdateGenset } from '../api/update-genset';

const SFOC_POINTS = [
  { key: 'p25', loadPct: 25 },
  { key: 'p50', loadPct: 50 },
  { key: 'p75', loadPct: 75 },
  { key: 'p85', loadPct: 85 },
  { key: 'p100', loadPct: 100 },
] as const;

const FIELD_NAMES = [
  'designation',
  'busSectionId',
  'ratedKw',
  'ratedKva',
  'voltageV',
  'frequencyHz',
  'speedClass',
  'minLoadPct',
  'maxLoadPct',
  'startCostKg',
  'minUpH',
  'minDownH',
  'duty',
  'shopTestSfoc',
  ...SFOC_POINTS.map((p) => `shopTestSfoc.${p.key}`),
] as const;

type NumberFieldName = 'ratedKw' | 'ratedKva' | 'voltageV' | 'minLoadPct' | 'maxLoadPct' | 'startCostKg' | 'minUpH' | 'minDownH';

interface GensetFormProps {
  vesselId: string;
  busSections: { id: string; name: string }[];
  /** The set to edit; absent when adding one. */
  genset?: Genset;
  onDone: () => void;
  onCancel: () => void;
}

function defaultsFor(genset: Genset | undefined, busSections: { id: string }[]): DefaultValues<GensetInput> {
  if (!genset) {
    return {
      designation: '',
      busSectionId: busSections[0]?.id ?? null,
      frequencyHz: 60,
      speedClass: 'medium',
      duty: 'service',
      startCostKg: 0,
      minUpH: 0,
      minDownH: 0,
      shopTestSfoc: { p25: null, p50: null, p75: null, p85: null, p100: null },
      maintenance: [],
    };
  }
  const { designation, busSectionId, ratedKw, ratedKva, voltageV, speedClass, minLoadPct, maxLoadPct, startCostKg, minUpH, minDownH, shopTestSfoc, duty } =
    genset;
  return {
    designation,
    busSectionId,
    ratedKw,
    ratedKva,
    voltageV,
    frequencyHz: genset.frequencyHz === 50 ? 50 : 60,
    speedClass,
    minLoadPct,
    maxLoadPct,
    startCostKg,
    minUpH,
    minDownH,
    shopTestSfoc,
    duty,
    // Kept as they are: this form does not edit the maintenance schedule.
    maintenance: genset.maintenance.map(({ id: _id, ...item }) => item),
  };
}

/** Add or edit one set of the genset register; errors from the schema or the server show beside their fields. */
export function GensetForm({ vesselId, busSections, genset, onDone, onCancel }: GensetFormProps) {
  const create = useCreateGenset();
  const update = useUpdateGenset();
  const mutation = genset ? update : create;
  const form = useForm<GensetInput, unknown, z.output<typeof gensetInputSchema>>({
    resolver: zodResolver(gensetInputSchema, numberFieldMessages),
    defaultValues: defaultsFor(genset, busSections),
  });
  const { errors } = form.formState;
  const server = useServerErrors(form.setError, FIELD_NAMES);
  const idFor = (name: string) => `genset-${name.replace('.', '-')}`;
  // A plain function, not a component: a component declared here would remount its input on every render.
  const numberField = (name: NumberFieldName, label: string, unit: string, hint?: string) => (
    <Field label={label} htmlFor={idFor(name)} error={errors[name]?.message} hint={hint}>
      <Input id={idFor(name)} type="number" inputMode="decimal" unit={unit} invalid={!!errors[name]} {...form.register(name, { setValueAs: toNumber })} />
    </Field>
  );

  const submit = form.handleSubmit((input) => {
    const callbacks = { onSuccess: () => onDone(), onError: server.onError };
    server.clear();
    if (genset) update.mutate({ vesselId, gensetId: genset.id, input }, callbacks);
    else create.mutate({ vesselId, input }, callbacks);
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-6" aria-label={genset ? `Edit ${genset.designation}` : 'Add a set'} data-form="genset">
      {server.problem ? <Alert tone="error">{server.problem}</Alert> : null}

      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 text-small font-bold uppercase text-hull-500">Identity</legend>
        <Field label="Designation" htmlFor={idFor('designation')} error={errors.designation?.message}>
          <Input id={idFor('designation')} placeholder="DG1" invalid={!!errors.designation} {...form.register('designation')} />
        </Field>
        <Field label="Bus section" htmlFor={idFor('busSectionId')} error={errors.busSectionId?.message}>
          <Select id={idFor('busSectionId')} invalid={!!errors.busSectionId} {...form.register('busSectionId', { setValueAs: (v: unknown) => (v === '' ? null : v) })}>
            <option value="">None (emergency switchboard)</option>
            {busSections.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Duty" htmlFor={idFor('duty')} error={errors.duty?.message}>
          <Select id={idFor('duty')} {...form.register('duty')}>
            <option value="service">Service</option>
            <option value="emergency">Emergency</option>
          </Select>
        </Field>
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 text-small font-bold uppercase text-hull-500">Rating</legend>
        {numberField('ratedKw', 'Rated power', 'kW')}
        {numberField('ratedKva', 'Rated apparent power', 'kVA')}
        {numberField('voltageV', 'Voltage', 'V')}
        <Field label="Frequency" htmlFor={idFor('frequencyHz')} error={errors.frequencyHz?.message}>
          <Select id={idFor('frequencyHz')} {...form.register('frequencyHz', { setValueAs: toNumber })}>
            <option value={60}>60 Hz</option>
            <option value={50}>50 Hz</option>
          </Select>
        </Field>
        <Field label="Speed class" htmlFor={idFor('speedClass')} error={errors.speedClass?.message}>
          <Select id={idFor('speedClass')} {...form.register('speedClass')}>
            <option value="high">High speed</option>
            <option value="medium">Medium speed</option>
            <option value="low">Low speed</option>
          </Select>
        </Field>
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 text-small font-bold uppercase text-hull-500">Load limits and starts</legend>
        {numberField('minLoadPct', 'Minimum load', '%', 'Share of rated power')}
        {numberField('maxLoadPct', 'Maximum continuous load', '%', 'Share of rated power')}
        {numberField('startCostKg', 'Fuel per start', 'kg')}
        {numberField('minUpH', 'Minimum running time', 'h')}
        {numberField('minDownH', 'Minimum stop time', 'h')}
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-5">
        <legend className="mb-2 text-small font-bold uppercase text-hull-500">Shop-test SFOC (leave blank where not measured)</legend>
        {SFOC_POINTS.map(({ key, loadPct }) => {
          const error = errors.shopTestSfoc?.[key]?.message;
          return (
            <Field key={key} label={`At ${loadPct} % load`} htmlFor={idFor(`shopTestSfoc.${key}`)} error={error}>
              <Input
                id={idFor(`shopTestSfoc.${key}`)}
                type="number"
                inputMode="decimal"
                step="0.1"
                unit="g/kWh"
                invalid={!!error}
                {...form.register(`shopTestSfoc.${key}`, { setValueAs: toNumberOrNull })}
              />
            </Field>
          );
        })}
      </fieldset>

      <FormActions submitLabel={genset ? 'Save changes' : 'Add set'} pending={mutation.isPending} onCancel={onCancel} />
    </form>
  );
}
