"use client";
// A refusal from the API ({ error: { message, fields } }) put beside the fields it names.
import { useCallback } from "react";
import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import type { ApiError } from "@/lib/client/api";

export type ServerErrorOptions = {
  /** The form's name for an API field, when they differ (e.g. extensionMm → extension). */
  fieldOf?: (apiField: string) => string;
  /** Whether the form has a field of that name; a message for any other field is returned instead. */
  isField?: (formField: string) => boolean;
  /** Re-words a message in the form's units (the API speaks N and mm; a form may type kN or kip): `speakUnits`. */
  speak?: (message: string) => string;
};

export type PlacedErrors = {
  /** Form fields that got a message, in the order the server gave them. */
  placed: string[];
  /** Messages for fields this form does not show (or a refusal that names no field). */
  unplaced: string[];
};

export function placeServerErrors<T extends FieldValues>(error: ApiError, setError: UseFormSetError<T>, opts: ServerErrorOptions = {}): PlacedErrors {
  const placed: string[] = [];
  const unplaced: string[] = [];
  const speak = opts.speak ?? ((m: string) => m);
  for (const [apiField, raw] of Object.entries(error.fields)) {
    const message = speak(raw);
    const field = opts.fieldOf?.(apiField) ?? apiField;
    if (field === "_" || (opts.isField && !opts.isField(field))) unplaced.push(message);
    else {
      setError(field as Path<T>, { type: "server", message });
      placed.push(field);
    }
  }
  if (!placed.length && !unplaced.length) unplaced.push(speak(error.message));
  return { placed, unplaced };
}

/** placeServerErrors bound to one form. */
export function useServerErrors<T extends FieldValues>(setError: UseFormSetError<T>, opts: ServerErrorOptions = {}) {
  const { fieldOf, isField, speak } = opts;
  return useCallback((error: ApiError) => placeServerErrors(error, setError, { fieldOf, isField, speak }), [setError, fieldOf, isField, speak]);
}
