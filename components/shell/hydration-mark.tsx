"use client";

import { useEffect } from "react";

/** Marks the document once the shell has hydrated: what the page-speed bench (bench/pages.ts) waits for. */
export function HydrationMark() {
  useEffect(() => {
    document.documentElement.dataset.hydrated = "1";
    return () => {
      delete document.documentElement.dataset.hydrated;
    };
  }, []);
  return null;
}
