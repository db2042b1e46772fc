// Small pieces for picking from lists: a labelled checkbox, a group of checkboxes over a list of values,
// and a text field with a button that adds what was typed (Enter adds too).
import { useState, type ReactNode } from 'react';
import { Button } from './button';
import { TextField } from './field';

export function CheckboxField({
  label,
  checked,
  onChange,
  className = 'inline-flex min-h-11 items-center gap-2 text-sm font-semibold text-ink-800',
}: {
  label: ReactNode;
  checked: boolean;
  onChange: (checked: boolean) => void;
  className?: string;
}) {
  return (
    <label className={className}>
      <input
        type="checkbox"
        className="size-4 accent-rust-500"
        checked={checked}
        onChange={(e) => onChange(e.target.checked)}
      />
      {label}
    </label>
  );
}

/** One checkbox per option; `value` holds the ticked ones, in the order they were ticked. */
export function CheckboxGroup<T extends string>({
  options,
  value,
  onChange,
  label = (o) => o,
  className = 'flex flex-wrap gap-x-4 gap-y-1',
}: {
  options: readonly T[];
  value: readonly T[];
  onChange: (next: T[]) => void;
  label?: (option: T) => ReactNode;
  className?: string;
}) {
  return (
    <div className={className}>
      {options.map((o) => (
        <CheckboxField
          key={o}
          className="inline-flex min-h-9 items-center gap-2"
          label={label(o)}
          checked={value.includes(o)}
          onChange={(on) => onChange(on ? [...value, o] : value.filter((x) => x !== o))}
        />
      ))}
    </div>
  );
}

export function AddItemField({
  label,
  button = 'Add',
  onAdd,
}: {
  label: string;
  button?: string;
  onAdd: (item: string) => void;
}) {
  const [text, setText] = useState('');
  const add = () => {
    const item = text.trim();
    if (item) onAdd(item);
    setText('');
  };
  return (
    <div className="flex items-end gap-2">
      <div className="grow">
        <TextField
          label={label}
          value={text}
          autoComplete="off"
          onChange={(e) => setText(e.target.value)}
          onKeyDown={(e) => {
            if (e.key === 'Enter') {
              e.preventDefault();
              add();
            }
          }}
        />
      </div>
      <Button variant="secondary" onClick={add}>
        {button}
      </Button>
    </div>
  );
}
