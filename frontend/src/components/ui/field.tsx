import { useId } from 'react';
import type { ComponentProps, ReactNode } from 'react';

export const controlClass =
  'block w-full rounded-control border border-paper-300 bg-paper-50 px-2.5 py-1.5 text-base text-ink-900 ' +
  'placeholder:text-ink-400 hover:border-ink-300 aria-[invalid=true]:border-danger-600 disabled:bg-paper-200';

interface FieldShellProps {
  id: string;
  label: string;
  hint?: ReactNode | undefined;
  error?: string | undefined;
  className?: string | undefined;
  children: ReactNode;
}

/** Label above, control, then hint or error; the error is tied to the control for screen readers. */
function FieldShell({ id, label, hint, error, className, children }: FieldShellProps) {
  return (
    <div className={`flex flex-col gap-1 ${className ?? ''}`}>
      <label htmlFor={id} className="text-sm font-medium text-ink-800">
        {label}
      </label>
      {children}
      {error ? (
        <p id={`${id}-error`} className="text-sm text-danger-700">
          {error}
        </p>
      ) : hint ? (
        <p id={`${id}-hint`} className="text-sm text-ink-500">
          {hint}
        </p>
      ) : null}
    </div>
  );
}

const describedBy = (id: string, error?: string, hint?: ReactNode) =>
  error ? `${id}-error` : hint ? `${id}-hint` : undefined;

type Common = { label: string; hint?: ReactNode; error?: string | undefined; fieldClassName?: string };

export function TextField({ label, hint, error, fieldClassName, className, ...input }: Common & ComponentProps<'input'>) {
  const id = useId();
  return (
    <FieldShell id={id} label={label} hint={hint} error={error} className={fieldClassName}>
      <input
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, error, hint)}
        className={`${controlClass} ${input.type === 'number' ? 'num' : ''} ${className ?? ''}`}
        {...input}
      />
    </FieldShell>
  );
}

export function TextAreaField({ label, hint, error, fieldClassName, className, ...area }: Common & ComponentProps<'textarea'>) {
  const id = useId();
  return (
    <FieldShell id={id} label={label} hint={hint} error={error} className={fieldClassName}>
      <textarea
        id={id}
        rows={3}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, error, hint)}
        className={`${controlClass} ${className ?? ''}`}
        {...area}
      />
    </FieldShell>
  );
}

export function SelectField({ label, hint, error, fieldClassName, className, children, ...select }: Common & ComponentProps<'select'>) {
  const id = useId();
  return (
    <FieldShell id={id} label={label} hint={hint} error={error} className={fieldClassName}>
      <select
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, error, hint)}
        className={`${controlClass} ${className ?? ''}`}
        {...select}
      >
        {children}
      </select>
    </FieldShell>
  );
}
