import { Button } from '@/components/ui/button';

export function FormFooter({
  failure,
  submitting,
  submitLabel,
  onCancel,
  extra,
}: {
  failure: string | null;
  submitting: boolean;
  submitLabel: string;
  onCancel: () => void;
  extra?: React.ReactNode;
}) {
  return (
    <div className="space-y-3 pt-2">
      {failure ? (
        <p
          role="alert"
          className="rounded-sm border border-danger bg-danger-soft p-2 text-sm text-danger"
        >
          {failure}
        </p>
      ) : null}
      <div className="flex flex-wrap items-center justify-end gap-2">
        {extra}
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" disabled={submitting}>
          {submitting ? 'Saving…' : submitLabel}
        </Button>
      </div>
    </div>
  );
}
