import { useCallback, useMemo, useRef, useState, type Dispatch, type SetStateAction } from "react";
import type { ZodTypeAny, z } from "zod";
import type { FieldErrors } from "../../shared/errors";
import { isFieldName, splitError, validate, type FieldNames } from "./errors";

/** Shown at the top of a form when the check finds more than one field wrong. */
export const MANY_FIELDS_MESSAGE = "Some fields need attention.";

export interface ZodFormOptions<V extends object, S extends ZodTypeAny> {
  /** One of the shared zod schemas (the server parses the same one), or a screen's own for text inputs. */
  schema: S;
  /** The values the inputs start from; a function is called once. */
  initial: V | (() => V);
  /**
   * What the schema parses, made from the form's values. Leave it out when the values are the schema's
   * input already (`V` = `z.input<S>`); give it where inputs hold text for numbers ("8.75" → 875). Any field
   * may still be missing (a choice not made yet): the schema's check says so beside it.
   */
  toInput?: (values: V) => Draft<z.input<S>>;
  /**
   * The field names this form shows an error beside (the schema's paths, as the server names them too),
   * or a test for them (rows of a list: `lines.0.quantity`). A rejected request's errors for any other name
   * go to the top of the form; so does the check's first message for a name not listed here (given
   * explicitly). Defaults to the keys of the initial values.
   */
  fields?: FieldNames;
  /** The top message when several fields are wrong; null to show only the field messages. */
  manyMessage?: string | null;
  /** The top message for a rejected request (default: its own message), e.g. words for a known error code. */
  errorMessage?: (error: unknown) => string;
}

export interface ResetOptions {
  /** Keep the "saved" state (the reload after a save brings the stored values back). */
  keepSaved?: boolean;
}

export interface ZodForm<V extends object, Out> {
  values: V;
  /** `set("name")` is an onChange handler for that field. */
  set: <K extends keyof V>(key: K) => (value: V[K]) => void;
  setValue: <K extends keyof V>(key: K, value: V[K]) => void;
  patch: (changes: Partial<V>) => void;
  /** Start again from these values (a reload from the server): errors cleared, not dirty. */
  reset: (values: V, options?: ResetOptions) => void;
  /** Props for a TextField bound to a text value: value, onChangeText and its error. */
  text: <K extends StringKeys<V>>(key: K) => { value: string; onChangeText: (value: string) => void; error: string | undefined };
  errors: FieldErrors;
  /** Set or clear field messages by hand (a check made outside the schema, such as a picked file's type). */
  setErrors: Dispatch<SetStateAction<FieldErrors>>;
  formError: string | null;
  setFormError: (message: string | null) => void;
  /** Shows errors from outside the submit (a second action on the same form). */
  fail: (error: unknown) => void;
  /** The last submit went through and nothing was changed since. */
  saved: boolean;
  submitting: boolean;
  /** The values differ from the ones last loaded or saved. */
  dirty: boolean;
  /**
   * Check the values with the schema; when they pass, run `onValid` with the parsed data (usually a
   * mutation's `mutateAsync`). A rejection is split into field and form errors. Resolves true when saved.
   */
  submit: (onValid: (data: Out) => unknown) => Promise<boolean>;
}

/** A schema input whose fields may still be left out or null (the form's check names them). */
export type Draft<T> = T extends object ? { [K in keyof T]?: T[K] | null } : T;

type StringKeys<V> = { [K in keyof V]: V[K] extends string ? K : never }[keyof V];

function same(a: unknown, b: unknown): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

/**
 * The one way Panwise builds a form: values typed by the form, checked with a zod schema before sending,
 * the server's field errors put beside the same fields, anything else at the top, and one submit at a time.
 */
export function useZodForm<V extends object, S extends ZodTypeAny>(options: ZodFormOptions<V, S>): ZodForm<V, z.output<S>> {
  const { schema, toInput, manyMessage = MANY_FIELDS_MESSAGE, errorMessage } = options;
  const [values, setValues] = useState<V>(options.initial);
  const [baseline, setBaseline] = useState<V>(values);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const [submitting, setSubmitting] = useState(false);
  const busy = useRef(false);
  const latest = useRef(values);
  latest.current = values;
  const fieldNames = useMemo<FieldNames>(() => options.fields ?? (Object.keys(values) as string[]), [options.fields, values]);
  const explicitFields = options.fields !== undefined;

  const patch = useCallback((changes: Partial<V>) => {
    setSaved(false);
    setValues((v) => ({ ...v, ...changes }));
  }, []);
  const setValue = useCallback(<K extends keyof V>(key: K, value: V[K]) => patch({ [key]: value } as unknown as Partial<V>), [patch]);
  const set = useCallback(<K extends keyof V>(key: K) => (value: V[K]) => setValue(key, value), [setValue]);
  const reset = useCallback((next: V, resetOptions?: ResetOptions) => {
    setValues(next);
    setBaseline(next);
    setErrors({});
    setFormError(null);
    if (!resetOptions?.keepSaved) setSaved(false);
  }, []);
  const fail = useCallback(
    (error: unknown) => {
      const split = splitError(error, fieldNames);
      setErrors(split.fields);
      setFormError(split.formError !== null && errorMessage ? errorMessage(error) : split.formError);
    },
    [fieldNames, errorMessage],
  );

  const submit = async (onValid: (data: z.output<S>) => unknown): Promise<boolean> => {
    if (busy.current) return false;
    setFormError(null);
    setSaved(false);
    const sent = latest.current;
    const checked = validate(schema, toInput ? toInput(sent) : sent);
    if (!checked.ok) {
      setErrors(checked.fields);
      const elsewhere = explicitFields ? Object.keys(checked.fields).find((name) => !isFieldName(fieldNames, name)) : undefined;
      const many = manyMessage && Object.keys(checked.fields).length > 1 ? manyMessage : null;
      setFormError(elsewhere !== undefined ? checked.fields[elsewhere] : many);
      return false;
    }
    setErrors({});
    busy.current = true;
    setSubmitting(true);
    try {
      await onValid(checked.data);
      setBaseline(sent);
      setSaved(true);
      return true;
    } catch (error) {
      fail(error);
      return false;
    } finally {
      busy.current = false;
      setSubmitting(false);
    }
  };

  const text = <K extends StringKeys<V>>(key: K) => ({
    value: values[key] as unknown as string,
    onChangeText: set(key) as unknown as (value: string) => void,
    error: errors[key as string],
  });

  return {
    values,
    set,
    setValue,
    patch,
    reset,
    text,
    errors,
    setErrors,
    formError,
    setFormError,
    fail,
    saved,
    submitting,
    dirty: !same(values, baseline),
    submit,
  };
}
