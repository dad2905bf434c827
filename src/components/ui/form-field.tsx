import { useId, type ReactNode } from 'react';
import { cn } from '@/lib/cn.js';
import { Input, type InputProps } from './input.js';
import { Select, type SelectProps } from './select.js';

/** What a control needs to be tied to its label, hint and error. */
export interface FieldControlProps {
  id: string;
  'aria-invalid': boolean;
  'aria-describedby'?: string;
}

interface FormFieldProps {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
  className?: string;
  /** Hides the label visually (it still names the control), for compact table rows. */
  labelHidden?: boolean;
  children: (control: FieldControlProps) => ReactNode;
}

/**
 * Label, control, hint and the validation message right below the control. The message is
 * linked with aria-describedby so a screen reader reads it when the control gets focus.
 */
export function FormField({ label, error, hint, className, labelHidden, children }: FormFieldProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [errorId, hintId].filter(Boolean).join(' ') || undefined;
  return (
    <div className={cn('flex flex-col gap-1.5', className)}>
      <label htmlFor={id} className={cn('text-sm font-medium text-ink-950', labelHidden && 'sr-only')}>
        {label}
      </label>
      {children({ id, 'aria-invalid': Boolean(error), 'aria-describedby': describedBy })}
      {error && (
        <p id={errorId} className="flex items-start gap-1.5 text-sm text-vermilion-700">
          <svg className="mt-0.5 size-3.5 shrink-0" viewBox="0 0 16 16" aria-hidden="true">
            <circle cx="8" cy="8" r="7" fill="currentColor" />
            <path d="M8 4.5v4.2M8 11.2h.01" stroke="white" strokeWidth="1.8" strokeLinecap="round" />
          </svg>
          <span>{error}</span>
        </p>
      )}
      {hint && (
        <p id={hintId} className="text-xs text-ink-600">
          {hint}
        </p>
      )}
    </div>
  );
}

type TextFieldProps = Omit<InputProps, 'id'> & { label: ReactNode; error?: string; hint?: ReactNode; fieldClassName?: string };

export function TextField({ label, error, hint, fieldClassName, ...input }: TextFieldProps) {
  return (
    <FormField label={label} error={error} hint={hint} className={fieldClassName}>
      {(control) => <Input {...input} {...control} />}
    </FormField>
  );
}

type SelectFieldProps = Omit<SelectProps, 'id'> & {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
  fieldClassName?: string;
  labelHidden?: boolean;
};

export function SelectField({ label, error, hint, fieldClassName, labelHidden, ...select }: SelectFieldProps) {
  return (
    <FormField label={label} error={error} hint={hint} className={fieldClassName} labelHidden={labelHidden}>
      {(control) => <Select {...select} {...control} />}
    </FormField>
  );
}
