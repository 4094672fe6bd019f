import { useState } from 'react';
import type { AuditEntry } from '../../../../shared/schemas/users';
import { Button } from '../../../components/ui/button';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatDateTime } from '../../../lib/format';

function Snapshot({ label, value }: { label: string; value: unknown }) {
  if (value === null || value === undefined) return null;
  return (
    <div>
      <p className="text-caption font-semibold uppercase text-hull-500">{label}</p>
      <pre className="max-h-64 overflow-auto rounded-plate bg-deck-50 p-2 text-caption text-hull-800">{JSON.stringify(value, null, 2)}</pre>
    </div>
  );
}

/** Who changed what and when; each row opens to show the record before and after. */
export function AuditTable({ entries }: { entries: AuditEntry[] }) {
  const [open, setOpen] = useState<number | null>(null);
  return (
    <Table caption="Audit trail">
      <thead>
        <tr>
          <Th>When</Th>
          <Th>Who</Th>
          <Th>Action</Th>
          <Th>Record</Th>
          <Th className="text-right">Change</Th>
        </tr>
      </thead>
      <tbody>
        {entries.map((e) => (
          <tr key={e.id} data-audit-entry={e.id}>
            <Td className="whitespace-nowrap">{formatDateTime(e.at)}</Td>
            <Td>{e.userEmail ?? 'system'}</Td>
            <Td>{e.action}</Td>
            <Td>
              {e.entity} <span className="text-caption text-hull-500">{e.entityId}</span>
              {open === e.id ? (
                <div className="mt-2 grid gap-2 md:grid-cols-2">
                  <Snapshot label="Before" value={e.before} />
                  <Snapshot label="After" value={e.after} />
                </div>
              ) : null}
            </Td>
            <Td className="text-right">
              <Button variant="quiet" size="sm" onClick={() => setOpen(open === e.id ? null : e.id)} aria-expanded={open === e.id}>
                {open === e.id ? 'Hide' : 'Show'}
              </Button>
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
