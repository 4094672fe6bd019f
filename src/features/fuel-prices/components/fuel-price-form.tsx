import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { fuelPriceInputSchema, PRICED_FUEL_GRADES, type FuelPriceInput } from '../../../../shared/schemas/savings';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, Input, Select } from '../../../components/ui/form-field';
import { useServerErrors } from '../../../lib/form-errors';
import { numberFieldMessages, toNumber } from '../../../lib/number-fields';
import { usePutFuelPrice } from '../api/put-fuel-price';

const FIELD_NAMES = ['grade', 'pricePerT', 'validFrom'] as const;

/** Sets a grade's price per tonne from a date (a price of the same grade and date is replaced). */
/** "LPG (propane)" for the code LPG_PROPANE; other grades as the trade writes them (MGO, VLSFO…). */
const gradeLabel = (grade: string) => grade.replace(/^(\w+)_(\w+)$/, (_, g: string, kind: string) => `${g} (${kind.toLowerCase()})`);

export function FuelPriceForm({ currency, today }: { currency: string; today: string }) {
  const put = usePutFuelPrice();
  const form = useForm<FuelPriceInput>({
    resolver: zodResolver(fuelPriceInputSchema, numberFieldMessages),
    defaultValues: { grade: 'VLSFO', validFrom: today },
  });
  const server = useServerErrors(form.setError, FIELD_NAMES);
  const e = form.formState.errors;
  const submit = form.handleSubmit((input) => {
    server.clear();
    put.mutate(input, { onSuccess: () => form.reset({ grade: input.grade, validFrom: input.validFrom }), onError: server.onError });
  });
  return (
    <form onSubmit={submit} noValidate aria-label="Set a fuel price" data-form="fuel-price" className="flex flex-col gap-3">
      {server.problem ? <Alert tone="error">{server.problem}</Alert> : null}
      {put.isSuccess ? <Alert tone="success">Price saved. Savings and reports are costed with it from its date on.</Alert> : null}
      <div className="flex flex-wrap items-end gap-3">
        <Field label="Grade" htmlFor="price-grade" error={e.grade?.message}>
          <Select id="price-grade" invalid={!!e.grade} {...form.register('grade')}>
            {PRICED_FUEL_GRADES.map((g) => (
              <option key={g} value={g}>
                {gradeLabel(g)}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Price per tonne" htmlFor="price-per-t" error={e.pricePerT?.message}>
          <Input id="price-per-t" type="number" min={0} step="any" unit={`${currency}/t`} className="w-48" invalid={!!e.pricePerT} {...form.register('pricePerT', { setValueAs: toNumber })} />
        </Field>
        <Field label="Valid from" htmlFor="price-from" error={e.validFrom?.message}>
          <Input id="price-from" type="date" invalid={!!e.validFrom} {...form.register('validFrom')} />
        </Field>
        <Button type="submit" pending={put.isPending} pendingLabel="Saving…">
          Save price
        </Button>
      </div>
    </form>
  );
}
