// Labelled form fields that show their error under the input and announce it to screen readers.
import {
  useId,
  type InputHTMLAttributes,
  type ReactNode,
  type SelectHTMLAttributes,
  type TextareaHTMLAttributes,
} from 'react';

interface FieldShell {
  label: string;
  error?: string | undefined;
  hint?: ReactNode;
}

const inputClass = (error?: string) =>
  `block w-full rounded-md border bg-chalk-50 px-3 py-2 text-base text-ink-900 placeholder:text-ink-400 focus:border-ink-700 ${
    error ? 'border-breach-600' : 'border-ink-300'
  }`;

function Shell({ id, label, error, hint, children }: FieldShell & { id: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold text-ink-800">
        {label}
      </label>
      {children}
      {hint && !error ? (
        <p id={`${id}-hint`} className="text-sm text-ink-500">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} role="alert" className="text-sm font-medium text-breach-700">
          {error}
        </p>
      ) : null}
    </div>
  );
}

/** The id and accessibility attributes that tie a control to its label, hint and error. */
function useControl(id: string | undefined, error?: string, hint?: ReactNode) {
  const auto = useId();
  const fid = id ?? auto;
  return {
    id: fid,
    'aria-invalid': error ? true : undefined,
    'aria-describedby': error ? `${fid}-error` : hint ? `${fid}-hint` : undefined,
    className: inputClass(error),
  };
}

export function TextField({ label, error, hint, id, ...props }: FieldShell & InputHTMLAttributes<HTMLInputElement>) {
  const control = useControl(id, error, hint);
  return (
    <Shell id={control.id} label={label} error={error} hint={hint}>
      <input {...control} {...props} />
    </Shell>
  );
}

export function SelectField({
  label,
  error,
  hint,
  id,
  children,
  ...props
}: FieldShell & SelectHTMLAttributes<HTMLSelectElement>) {
  const control = useControl(id, error, hint);
  return (
    <Shell id={control.id} label={label} error={error} hint={hint}>
      <select {...control} {...props}>
        {children}
      </select>
    </Shell>
  );
}

export function TextAreaField({
  label,
  error,
  hint,
  id,
  ...props
}: FieldShell & TextareaHTMLAttributes<HTMLTextAreaElement>) {
  const control = useControl(id, error, hint);
  return (
    <Shell id={control.id} label={label} error={error} hint={hint}>
      <textarea {...control} {...props} />
    </Shell>
  );
}

/**
 * A select's options, each value with its label: the labels' own order, or `values` when given (a subset or
 * another order). Values travel as strings, like any option's.
 */
export function LabelledOptions<K extends string | number>({
  labels,
  values,
}: {
  labels: Readonly<Record<K, ReactNode>>;
  values?: readonly K[];
}) {
  const keys = values ?? (Object.keys(labels) as K[]);
  return (
    <>
      {keys.map((k) => (
        <option key={k} value={k}>
          {labels[k]}
        </option>
      ))}
    </>
  );
}

/**
 * An e-mail address field: the phone's e-mail keyboard, and the address offered as the account name by
 * password managers unless `autoComplete` says otherwise (an invitation's address is someone else's).
 */
export function EmailField({
  label = 'E-mail',
  autoComplete = 'username',
  ...props
}: Omit<FieldShell, 'label'> & { label?: string } & Omit<InputHTMLAttributes<HTMLInputElement>, 'type'>) {
  return <TextField label={label} type="email" inputMode="email" autoComplete={autoComplete} {...props} />;
}

/** A weight in the athlete's unit: the label names the unit, and a phone offers its number pad with a decimal point. */
export function WeightField({
  unit,
  ...props
}: Omit<FieldShell, 'label'> & { unit: string } & Omit<InputHTMLAttributes<HTMLInputElement>, 'type' | 'inputMode'>) {
  return <TextField label={`Weight (${unit})`} inputMode="decimal" autoComplete="off" {...props} />;
}
