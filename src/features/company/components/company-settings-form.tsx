import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { companySettingsSchema, type CompanySettings } from '../../../../shared/schemas/users';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, Input } from '../../../components/ui/form-field';
import { useServerErrors } from '../../../lib/form-errors';
import { useUpdateCompany } from '../api/update-company';

export function CompanySettingsForm({ settings, onSaved }: { settings: CompanySettings; onSaved?: () => void }) {
  const update = useUpdateCompany();
  const form = useForm({ resolver: zodResolver(companySettingsSchema), defaultValues: settings });
  const { errors, isDirty } = form.formState;
  const server = useServerErrors(form.setError, ['name', 'currency']);

  const submit = form.handleSubmit((values) => {
    server.clear();
    update.mutate(values, {
      onSuccess: () => {
        form.reset(values);
        onSaved?.();
      },
      onError: server.onError,
    });
  });

  return (
    <form onSubmit={submit} noValidate className="flex max-w-form flex-col gap-4" aria-label="Company settings" data-form="company">
      {server.problem ? <Alert tone="error">{server.problem}</Alert> : null}
      {update.isSuccess && !isDirty ? <Alert tone="success">Settings saved.</Alert> : null}
      <Field label="Company name" htmlFor="company-name" error={errors.name?.message}>
        <Input id="company-name" invalid={!!errors.name} {...form.register('name')} />
      </Field>
      <Field label="Currency" htmlFor="company-currency" error={errors.currency?.message} hint="Used for fuel prices and savings in reports">
        <Input id="company-currency" maxLength={3} className="w-28 uppercase" invalid={!!errors.currency} {...form.register('currency', { setValueAs: (v: string) => v.toUpperCase() })} />
      </Field>
      <div>
        <Button type="submit" pending={update.isPending} pendingLabel="Saving…" disabled={!isDirty}>
          Save settings
        </Button>
      </div>
    </form>
  );
}
