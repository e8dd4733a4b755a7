import { useEffect, useRef, useState, type FormEvent } from 'react';
import type { z } from 'zod';
import { formErrorsFromError, formErrorsFromIssues, type FormErrors } from '../lib/form-errors.ts';

const NO_ERRORS: FormErrors = { fieldErrors: {} };

/**
 * A form of uncontrolled inputs checked on submit with a shared contract schema — the same
 * one the server applies. `submit` gets the parsed values; if it rejects, the error is shown
 * at the field it names (when the form has one) or above the form. The first field in error
 * gets focus; editing a field clears its message.
 */
export function useSchemaForm<S extends z.ZodType>(schema: S, submit: (values: z.output<S>) => Promise<unknown>) {
  const formRef = useRef<HTMLFormElement>(null);
  const [errors, setErrors] = useState<FormErrors>(NO_ERRORS);
  const [submitting, setSubmitting] = useState(false);
  // Set when a submit fails, consumed after the next render; clearing one message moves no focus.
  const focusPending = useRef(false);

  const hasField = (name: string) => Boolean(formRef.current?.elements.namedItem(name));

  // Focus after render, so that the field is already marked invalid and described by its
  // message. The first field in the form's order, not the schema's.
  useEffect(() => {
    if (!focusPending.current) return;
    focusPending.current = false;
    const elements = Array.from(formRef.current?.elements ?? []) as Partial<HTMLInputElement>[];
    const first = elements.find((element) => element.name && errors.fieldErrors[element.name]);
    if (first instanceof HTMLElement) first.focus();
  }, [errors]);

  function show(next: FormErrors) {
    focusPending.current = true;
    setErrors(next);
  }

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    if (submitting) return;
    const values = Object.fromEntries(new FormData(event.currentTarget));
    const parsed = schema.safeParse(values);
    if (!parsed.success) {
      show(formErrorsFromIssues(parsed.error.issues, hasField));
      return;
    }
    setErrors(NO_ERRORS);
    setSubmitting(true);
    try {
      await submit(parsed.data);
    } catch (error) {
      show(formErrorsFromError(error, hasField));
    } finally {
      setSubmitting(false);
    }
  }

  function onChange(event: FormEvent<HTMLFormElement>) {
    const name = (event.target as Partial<HTMLInputElement>).name;
    if (name && errors.fieldErrors[name]) {
      setErrors((current) => ({ ...current, fieldErrors: { ...current.fieldErrors, [name]: undefined } }));
    }
  }

  return {
    formProps: { ref: formRef, onSubmit, onChange, noValidate: true },
    fieldErrors: errors.fieldErrors,
    formError: errors.formError,
    submitting,
  };
}
