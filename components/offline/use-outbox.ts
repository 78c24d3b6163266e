"use client";
// The outbox as React state: the signed-in person's items, refreshed when any tab changes them.
import { useEffect, useState } from "react";
import { isMine, listItems, subscribe, type OutboxItem } from "@/lib/client/outbox/store";

export function useOutbox(userId: string) {
  const [items, setItems] = useState<OutboxItem[] | null>(null);
  useEffect(() => {
    let live = true;
    const load = () => void listItems().then((all) => live && setItems(all.filter((i) => isMine(i, userId))), () => live && setItems([]));
    load();
    const off = subscribe(load);
    return () => {
      live = false;
      off();
    };
  }, [userId]);
  return items;
}
