import { useState, type ChangeEvent, type FormEvent } from 'react';
import type { z } from 'zod';
import { isApiError } from './api-client.js';
import { fieldErrors } from './zod-fields.js';

type Errors<V> = Partial<Record<keyof V & string, string>>;

/**
 * Form state checked with the same zod schema the server uses. Messages appear beside their
 * fields after the first submit and update as the person types; the server's own field messages
 * (422) land in the same places, and any other refusal becomes `formError`.
 */
export function useZodForm<V extends Record<string, string>, Out>(schema: z.ZodType<Out>, initial: V) {
  const [values, setValues] = useState<V>(initial);
  const [errors, setErrors] = useState<Errors<V>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [submitted, setSubmitted] = useState(false);
  const [submitting, setSubmitting] = useState(false);

  const check = (next: V): { data: Out | undefined; errors: Record<string, string> } => {
    const parsed = schema.safeParse(next);
    return parsed.success ? { data: parsed.data, errors: {} } : { data: undefined, errors: fieldErrors(parsed.error) };
  };

  const setValue = (name: keyof V & string, value: string) => {
    const next = { ...values, [name]: value };
    setValues(next);
    if (submitted) setErrors(check(next).errors as Errors<V>);
  };

  /** Props for a TextField / SelectField bound to one value. */
  const field = (name: keyof V & string) => ({
    name,
    value: values[name],
    error: errors[name],
    onChange: (e: ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setValue(name, e.target.value),
  });

  const handleSubmit = (onValid: (data: Out) => Promise<unknown> | unknown) => async (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    const form = e.currentTarget;
    setSubmitted(true);
    setFormError(null);
    const result = check(values);
    setErrors(result.errors as Errors<V>);
    if (result.data === undefined) {
      focusFirst(form, Object.keys(result.errors));
      if (result.errors._) setFormError(result.errors._);
      return;
    }
    setSubmitting(true);
    try {
      await onValid(result.data);
    } catch (err) {
      if (isApiError(err) && err.fields && Object.keys(err.fields).length) {
        setErrors(err.fields as Errors<V>);
        focusFirst(form, Object.keys(err.fields));
        if (!Object.keys(err.fields).some((k) => k in values)) setFormError(err.message);
      } else {
        setFormError(isApiError(err) ? err.message : 'Something went wrong. Please try again.');
      }
    } finally {
      setSubmitting(false);
    }
  };

  const reset = (next: V = initial) => {
    setValues(next);
    setErrors({});
    setFormError(null);
    setSubmitted(false);
  };

  return { values, errors, formError, submitting, field, setValue, handleSubmit, reset };
}

function focusFirst(form: HTMLFormElement, names: string[]) {
  for (const el of Array.from(form.elements)) {
    const name = (el as HTMLInputElement).name;
    if (name && names.includes(name)) {
      (el as HTMLElement).focus();
      return;
    }
  }
}
