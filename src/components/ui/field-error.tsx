import { fieldMessage } from "../../lib/form-errors";

export function FieldError({ id, label, message }: { id: string; label: string; message?: string }) {
  if (!message) return null;
  return (
    <p id={id} className="mt-1 font-bold text-danger">
      {fieldMessage(label, message)}
    </p>
  );
}
