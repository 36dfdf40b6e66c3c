import { useForm, type FieldValues, type Path, type Resolver, type UseFormProps, type UseFormReturn } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { BaseSyntheticEvent } from "react";
import type { z } from "zod";
import { isApiError } from "../../lib/api-client.ts";

/**
 * A form checked by one of the shared zod schemas, so the person reads the server's own messages before sending.
 * Checked on submit only, as our forms always were: a message stays until the next send, never flickers while typing.
 */
export function useZodForm<S extends z.ZodType<FieldValues, FieldValues>>(
  schema: S,
  options: Omit<UseFormProps<z.input<S>, unknown, z.output<S>>, "resolver"> = {},
): UseFormReturn<z.input<S>, unknown, z.output<S>> {
  return useForm<z.input<S>, unknown, z.output<S>>({
    resolver: zodResolver(schema),
    mode: "onSubmit",
    reValidateMode: "onSubmit",
    shouldFocusError: false,
    ...options,
  });
}

/**
 * A form whose inputs hold text as typed (numbers as strings, nothing lost to parsing) and whose request body is
 * made from them: `toInput` builds the body, the shared schema checks it, and its issue paths name the inputs.
 */
export function useZodFormAsTyped<V extends FieldValues, S extends z.ZodType>(
  schema: S,
  toInput: (values: V) => unknown,
  options: Omit<UseFormProps<V, unknown, z.output<S>>, "resolver"> = {},
): UseFormReturn<V, unknown, z.output<S>> {
  const check = zodResolver(schema as never);
  const resolver: Resolver<V, unknown, z.output<S>> = (values, context, opts) => check(toInput(values) as never, context, opts as never);
  return useForm<V, unknown, z.output<S>>({ resolver, mode: "onSubmit", reValidateMode: "onSubmit", shouldFocusError: false, ...options });
}

/** handleSubmit's handler for `onSubmit`, which wants no promise back. */
export const onSubmitOf =
  (handler: (e?: BaseSyntheticEvent) => Promise<void>) =>
  (e: BaseSyntheticEvent): void =>
    void handler(e);

/** The server's `fields` (the same `zodFields` shape) onto the inputs they name; what was typed stays. */
export function setServerErrors<V extends FieldValues>(form: Pick<UseFormReturn<V, unknown, never>, "setError">, error: unknown): void {
  if (!isApiError(error)) return;
  for (const [key, message] of Object.entries(error.fields)) form.setError(key as Path<V>, { type: "server", message });
}

/** A mutation's error when it belongs at the top of the form: one that names no field, so no input shows it. */
export function topError<E extends Error>(error: E | null): E | null {
  return error && !(isApiError(error) && Object.keys(error.fields).length) ? error : null;
}


/** RHF's nested errors as zodFields' dotted keys (`filter.priceMinCents`, `columns.2.header`), for widgets that take the flat map. */
export function flatErrors(errors: object, prefix = ""): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, node] of Object.entries(errors)) {
    if (key === "ref" || !node || typeof node !== "object") continue;
    const path = prefix ? `${prefix}.${key}` : key;
    const message = (node as { message?: unknown }).message;
    if (typeof message === "string") out[path] = message;
    else Object.assign(out, flatErrors(node as object, path));
  }
  return out;
}
