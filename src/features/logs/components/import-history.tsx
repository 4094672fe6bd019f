import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Alert } from '../../../components/ui/alert';
import { QueryView } from '../../../components/ui/states';
import { Table, Td, Th } from '../../../components/ui/table';
import { errorMessage } from '../../../lib/api-client';
import { formatDateTime } from '../../../lib/format';
import { useImports } from '../api/get-imports';
import { useUndoImport } from '../api/undo-import';

/** Who imported which file when, the counts, and undo. */
export function ImportHistory({ vesselId, mayUndo }: { vesselId: string; mayUndo: boolean }) {
  const imports = useImports(vesselId);
  const undo = useUndoImport(vesselId);
  return (
    <>
      {undo.error ? <Alert tone="error">{errorMessage(undo.error)}</Alert> : null}
      <QueryView query={imports} isEmpty={(d) => d.length === 0} empty={<p className="text-small text-hull-600">No imports yet.</p>}>
        {(rows) => (
          <Table caption="Import history">
            <thead>
              <tr><Th>When</Th><Th>Who</Th><Th>File</Th><Th numeric>New</Th><Th numeric>Overwritten</Th><Th numeric>Unchanged</Th><Th numeric>Rejected</Th><Th>Status</Th><Th /></tr>
            </thead>
            <tbody>
              {rows.map((r) => (
                <tr key={r.id}>
                  <Td>{formatDateTime(r.createdAt)}</Td>
                  <Td>{r.userName ?? '–'}</Td>
                  <Td>{r.fileName}</Td>
                  <Td numeric>{r.rowsNew}</Td>
                  <Td numeric>{r.rowsChanged}</Td>
                  <Td numeric>{r.rowsUnchanged}</Td>
                  <Td numeric>{r.rowsRejected}</Td>
                  <Td><Badge tone={r.status === 'committed' ? 'good' : 'neutral'}>{r.status}</Badge></Td>
                  <Td>
                    {mayUndo && r.status === 'committed' ? (
                      <Button size="sm" variant="secondary" pending={undo.isPending && undo.variables?.importId === r.id} onClick={() => window.confirm(`Undo the import of ${r.fileName}? Its new rows are removed and the values it overwrote restored.`) && undo.mutate({ vesselId, importId: r.id })}>
                        Undo
                      </Button>
                    ) : null}
                  </Td>
                </tr>
              ))}
            </tbody>
          </Table>
        )}
      </QueryView>
    </>
  );
}
