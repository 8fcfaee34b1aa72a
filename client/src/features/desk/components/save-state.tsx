import { SubmitButton } from '../../../components/ui/form-fields';

/**
 * The save button and what it honestly says: "Saved" only after the server answered with this version
 * and nothing on screen has changed since; changes on screen that have not been sent say so.
 */
export function SaveState({
  label,
  dirty,
  saving,
  saved,
}: {
  label: string;
  dirty: boolean;
  saving: boolean;
  saved: boolean;
}) {
  return (
    <div className="flex flex-wrap items-center gap-3">
      <SubmitButton>{label}</SubmitButton>
      <p role="status" className="text-sm font-semibold">
        {saving ? (
          <span className="text-ink-700">Saving…</span>
        ) : dirty ? (
          <span className="text-amber-deep">Not saved yet</span>
        ) : saved ? (
          <span className="text-ok">Saved</span>
        ) : null}
      </p>
    </div>
  );
}
