import { Button } from './button';

/** The submit and cancel buttons under a form. */
export function FormActions({ submitLabel, pending, onCancel, size = 'md' }: { submitLabel: string; pending: boolean; onCancel: () => void; size?: 'md' | 'sm' }) {
  return (
    <div className="flex gap-2">
      <Button type="submit" size={size} pending={pending} pendingLabel="Saving…">
        {submitLabel}
      </Button>
      <Button variant="quiet" size={size} onClick={onCancel}>
        Cancel
      </Button>
    </div>
  );
}
