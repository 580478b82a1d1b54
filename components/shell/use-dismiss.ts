"use client";

import { useEffect, type RefObject } from "react";

/** Closes an open menu on a tap outside `ref` or on Escape (focus goes back to the menu's button). */
export function useDismiss(ref: RefObject<HTMLElement | null>, open: boolean, close: (refocus: boolean) => void) {
  useEffect(() => {
    if (!open) return;
    const onPointer = (e: PointerEvent) => {
      if (ref.current && !ref.current.contains(e.target as Node)) close(false);
    };
    const onKey = (e: KeyboardEvent) => {
      if (e.key === "Escape") close(true);
    };
    document.addEventListener("pointerdown", onPointer);
    document.addEventListener("keydown", onKey);
    return () => {
      document.removeEventListener("pointerdown", onPointer);
      document.removeEventListener("keydown", onKey);
    };
  }, [ref, open, close]);
}
