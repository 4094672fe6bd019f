import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { WORK_WINDOW_KINDS, WORK_WINDOW_LABELS, workWindowInputSchema, type WorkWindow } from '../../../../shared/schemas/overhaul';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { FormActions } from '../../../components/ui/form-actions';
import { Field, Input, Select } from '../../../components/ui/form-field';
import { EmptyState } from '../../../components/ui/states';
import { Table, Td, Th } from '../../../components/ui/table';
import { useServerErrors } from '../../../lib/form-errors';
import { formatDate } from '../../../lib/format';
import { useDeleteWorkWindow } from '../api/delete-work-window';
import { useSaveWorkWindow } from '../api/save-work-window';

const FIELDS = ['kind', 'place', 'startsOn', 'endsOn'] as const;

function WindowForm({ vesselId, window, onDone }: { vesselId: string; window?: WorkWindow; onDone: () => void }) {
  const save = useSaveWorkWindow();
  const form = useForm<z.input<typeof workWindowInputSchema>, unknown, z.output<typeof workWindowInputSchema>>({
    resolver: zodResolver(workWindowInputSchema),
    defaultValues: window ? { kind: window.kind, place: window.place, startsOn: window.startsOn, endsOn: window.endsOn } : { kind: 'port_call', place: '', startsOn: '', endsOn: '' },
  });
  const server = useServerErrors(form.setError, FIELDS);
  const e = form.formState.errors;
  return (
    <form
      noValidate
      className="grid gap-3 md:grid-cols-5"
      data-form="work-window"
      onSubmit={form.handleSubmit((input) => {
        server.clear();
        save.mutate({ vesselId, windowId: window?.id, input }, { onSuccess: onDone, onError: server.onError });
      })}
    >
      {server.problem ? <div className="md:col-span-5"><Alert tone="error">{server.problem}</Alert></div> : null}
      <Field label="Kind" htmlFor="ww-kind" error={e.kind?.message}>
        <Select id="ww-kind" {...form.register('kind')}>{WORK_WINDOW_KINDS.map((k) => <option key={k} value={k}>{WORK_WINDOW_LABELS[k]}</option>)}</Select>
      </Field>
      <Field label="Place" htmlFor="ww-place" error={e.place?.message}><Input id="ww-place" {...form.register('place')} /></Field>
      <Field label="From" htmlFor="ww-from" error={e.startsOn?.message}><Input id="ww-from" type="date" {...form.register('startsOn')} /></Field>
      <Field label="To (inclusive)" htmlFor="ww-to" error={e.endsOn?.message}><Input id="ww-to" type="date" {...form.register('endsOn')} /></Field>
      <div className="self-end"><FormActions submitLabel={window ? 'Save window' : 'Add window'} pending={save.isPending} onCancel={onDone} size="sm" /></div>
    </form>
  );
}

/** Planned port calls and dry docks of a vessel; planners add, change and remove them. */
export function WorkWindows({ vesselId, windows, canEdit }: { vesselId: string; windows: WorkWindow[]; canEdit: boolean }) {
  const [editing, setEditing] = useState<string | 'new' | null>(null);
  const remove = useDeleteWorkWindow();
  return (
    <div className="space-y-3">
      {windows.length === 0 ? (
        <EmptyState title="No work windows yet" next={canEdit ? 'Add the planned port calls and dry docks in which work can be done.' : 'A planner or superintendent enters the planned port calls and dry docks.'} />
      ) : (
        <Table caption="Work windows">
          <thead>
            <tr><Th>Kind</Th><Th>Place</Th><Th>From</Th><Th>To</Th>{canEdit ? <Th /> : null}</tr>
          </thead>
          <tbody>
            {windows.map((w) =>
              editing === w.id ? (
                <tr key={w.id}><Td colSpan={5}><WindowForm vesselId={vesselId} window={w} onDone={() => setEditing(null)} /></Td></tr>
              ) : (
                <tr key={w.id}>
                  <Td>{WORK_WINDOW_LABELS[w.kind]}</Td>
                  <Td>{w.place}</Td>
                  <Td>{formatDate(w.startsOn)}</Td>
                  <Td>{formatDate(w.endsOn)}</Td>
                  {canEdit ? (
                    <Td className="space-x-2 text-right">
                      <Button size="sm" variant="secondary" onClick={() => setEditing(w.id)}>Change</Button>
                      <Button size="sm" variant="secondary" pending={remove.isPending && remove.variables?.windowId === w.id} onClick={() => remove.mutate({ vesselId, windowId: w.id })}>Remove</Button>
                    </Td>
                  ) : null}
                </tr>
              ),
            )}
          </tbody>
        </Table>
      )}
      {remove.isError ? <Alert tone="error">{remove.error.message}</Alert> : null}
      {canEdit ? editing === 'new' ? <WindowForm vesselId={vesselId} onDone={() => setEditing(null)} /> : <Button size="sm" onClick={() => setEditing('new')} data-action="add-window">Add a window</Button> : null}
    </div>
  );
}
