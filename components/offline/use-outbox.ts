"use client";
// The outbox as React state: every item, refreshed when any tab changes it.
import { useEffect, useState } from "react";
import { listItems, subscribe, type OutboxItem } from "@/lib/client/outbox/store";

export function useOutbox() {
  const [items, setItems] = useState<OutboxItem[] | null>(null);
  useEffect(() => {
    let live = true;
    const load = () => void listItems().then((all) => live && setItems(all), () => live && setItems([]));
    load();
    const off = subscribe(load);
    return () => {
      live = false;
      off();
    };
  }, []);
  return items;
}
