import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { Field, Input } from '../../../components/ui/form-field';
import { applyServerErrors } from '../../../lib/form-errors';
import { useCreateBusSection } from '../api/create-bus-section';

/** One-line form that adds a bus section (switchboard section) to a vessel. */
export function BusSectionForm({ vesselId }: { vesselId: string }) {
  const create = useCreateBusSection();
  const [name, setName] = useState('');
  const [error, setError] = useState<string | undefined>();

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const trimmed = name.trim();
    if (trimmed.length === 0 || trimmed.length > 20) {
      setError('Enter a name of 1 to 20 characters, such as B');
      return;
    }
    setError(undefined);
    create.mutate(
      { vesselId, name: trimmed },
      {
        onSuccess: () => setName(''),
        onError: (e) => {
          let onField: string | undefined;
          const rest = applyServerErrors(e, (_name, issue) => (onField = issue.message), ['name']);
          setError(rest ?? onField);
        },
      },
    );
  };

  return (
    <form onSubmit={submit} noValidate className="flex flex-wrap items-end gap-2" aria-label="Add a bus section">
      <Field label="New bus section" htmlFor="bus-section-name" error={error}>
        <Input id="bus-section-name" value={name} onChange={(e) => setName(e.target.value)} placeholder="B" invalid={!!error} className="w-40" />
      </Field>
      <Button type="submit" variant="secondary" pending={create.isPending} pendingLabel="Adding…" className="mb-[1px]">
        Add section
      </Button>
    </form>
  );
}
