"use client";
// What a user typed, kept on this device until the server has it: a draft is read once when the
// form opens (handed to onRestore) and written on every change; clear() forgets it after a save.
import { useCallback, useEffect, useEffectEvent, useState } from "react";

export function readLocalDraft<T>(key: string, accept: (raw: unknown) => T | null = (raw) => (raw && typeof raw === "object" ? (raw as T) : null)): T | null {
  try {
    const raw = window.localStorage.getItem(key);
    return raw ? accept(JSON.parse(raw)) : null;
  } catch {
    return null; // an unreadable draft is ignored
  }
}

export function useLocalDraft<T>(key: string, onRestore: (draft: T) => void, accept?: (raw: unknown) => T | null) {
  const [ready, setReady] = useState(false);
  const restore = useEffectEvent(() => {
    const d = readLocalDraft<T>(key, accept);
    if (d !== null) onRestore(d);
    setReady(true);
  });

  // localStorage exists only in the browser, so the draft is read after the first render.
  useEffect(() => restore(), [key]);

  const save = useCallback(
    (value: T) => {
      try {
        window.localStorage.setItem(key, JSON.stringify(value));
      } catch {
        /* storage full or blocked: the form itself still holds the values */
      }
    },
    [key],
  );

  const clear = useCallback(() => {
    try {
      window.localStorage.removeItem(key);
    } catch {
      /* nothing to forget */
    }
  }, [key]);

  return { ready, save, clear };
}
