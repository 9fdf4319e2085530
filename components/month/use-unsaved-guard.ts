"use client";

import { useEffect } from "react";

const QUESTION = "You have figures that are not saved. Leave this page and lose them?";

/**
 * Warns before unsaved figures are lost: the browser's own prompt for reloads and closing the
 * tab, and a confirm for in-app links and the header's forms (the App Router has no navigation
 * event to hook, so clicks and submits are caught on their way down instead).
 */
export function useUnsavedGuard(dirty: boolean, ownForm: React.RefObject<HTMLFormElement | null>) {
  useEffect(() => {
    if (!dirty) return;
    const beforeUnload = (e: BeforeUnloadEvent) => {
      e.preventDefault();
      e.returnValue = "";
    };
    const click = (e: MouseEvent) => {
      if (e.defaultPrevented || e.button !== 0 || e.metaKey || e.ctrlKey || e.shiftKey || e.altKey) return;
      const a = (e.target as Element | null)?.closest?.("a[href]") as HTMLAnchorElement | null;
      if (!a || a.target === "_blank" || a.hasAttribute("download")) return;
      const url = new URL(a.href, window.location.href);
      if (url.origin === window.location.origin && url.pathname === window.location.pathname) return;
      if (!window.confirm(QUESTION)) {
        e.preventDefault();
        e.stopPropagation();
      }
    };
    const submit = (e: SubmitEvent) => {
      const form = e.target as HTMLFormElement;
      if (form === ownForm.current || ownForm.current?.contains(form)) return;
      if (!window.confirm(QUESTION)) {
        e.preventDefault();
        e.stopPropagation();
      }
    };
    window.addEventListener("beforeunload", beforeUnload);
    document.addEventListener("click", click, true);
    document.addEventListener("submit", submit, true);
    return () => {
      window.removeEventListener("beforeunload", beforeUnload);
      document.removeEventListener("click", click, true);
      document.removeEventListener("submit", submit, true);
    };
  }, [dirty, ownForm]);
}
