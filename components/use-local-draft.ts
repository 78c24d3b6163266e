"use client";
// What a user typed, kept on this device until the server has it: a draft is read once when the
// form opens (handed to onRestore) and written on every change; clear() forgets it after a save.
// Drafts are kept per signed-in person (DraftOwnerProvider), so a shared phone never shows one
// person's unsaved entry to the next. A draft kept before drafts had owners is still restored.
import { useCallback, useEffect, useEffectEvent, useState } from "react";
import { useDraftOwner } from "./draft-owner";

export function readLocalDraft<T>(key: string, accept: (raw: unknown) => T | null = (raw) => (raw && typeof raw === "object" ? (raw as T) : null)): T | null {
  try {
    const raw = window.localStorage.getItem(key);
    return raw ? accept(JSON.parse(raw)) : null;
  } catch {
    return null; // an unreadable draft is ignored
  }
}

export function useLocalDraft<T>(baseKey: string, onRestore: (draft: T) => void, accept?: (raw: unknown) => T | null) {
  const owner = useDraftOwner();
  const key = owner ? `${baseKey}:by:${owner}` : baseKey;
  const [ready, setReady] = useState(false);
  const restore = useEffectEvent(() => {
    const d = readLocalDraft<T>(key, accept) ?? (key === baseKey ? null : readLocalDraft<T>(baseKey, accept));
    if (d !== null) onRestore(d);
    setReady(true);
  });

  // localStorage exists only in the browser, so the draft is read after the first render.
  useEffect(() => restore(), [key]);

  const save = useCallback(
    (value: T) => {
      try {
        window.localStorage.setItem(key, JSON.stringify(value));
        // A draft from before owners, now restored and saved again, becomes this person's.
        if (key !== baseKey) window.localStorage.removeItem(baseKey);
      } catch {
        /* storage full or blocked: the form itself still holds the values */
      }
    },
    [key, baseKey],
  );

  const clear = useCallback(() => {
    try {
      window.localStorage.removeItem(key);
      window.localStorage.removeItem(baseKey);
    } catch {
      /* nothing to forget */
    }
  }, [key, baseKey]);

  return { ready, save, clear };
}
