"use client";
// Whose drafts a form keeps: on a phone shared by a site team, a form typed by one person and not
// yet saved is restored only for that person, never for whoever signs in next (use-local-draft.ts).
import { createContext, useContext, type ReactNode } from "react";

const DraftOwner = createContext<string | null>(null);

export function DraftOwnerProvider({ userId, children }: { userId: string; children: ReactNode }) {
  return <DraftOwner.Provider value={userId}>{children}</DraftOwner.Provider>;
}

export function useDraftOwner() {
  return useContext(DraftOwner);
}
