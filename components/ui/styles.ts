/*
 * Shared class lists for controls, so buttons and inputs look alike everywhere without a
 * component per variant. Every interactive element keeps the global focus outline.
 */
export const buttonPrimary =
  "inline-flex items-center justify-center gap-1.5 border border-accent-strong bg-accent px-3.5 py-1.5 text-sm font-medium text-white hover:bg-accent-strong disabled:cursor-not-allowed disabled:opacity-60";

export const buttonSecondary =
  "inline-flex items-center justify-center gap-1.5 border border-rule-strong bg-paper px-3 py-1.5 text-sm font-medium text-ink hover:border-ink-soft hover:bg-paper-deep disabled:cursor-not-allowed disabled:opacity-60";

export const buttonDanger =
  "inline-flex items-center justify-center gap-1.5 border border-fault/50 bg-paper px-3 py-1.5 text-sm font-medium text-fault hover:bg-fault-wash disabled:cursor-not-allowed disabled:opacity-60";

export const input =
  "block w-full border border-rule-strong bg-white px-2.5 py-1.5 text-base text-ink placeholder:text-ink-faint aria-[invalid=true]:border-fault aria-[invalid=true]:bg-fault-wash/40";

export const label = "block text-sm font-medium text-ink";

export const link = "text-accent-strong underline decoration-accent/40 hover:decoration-accent-strong";

export const pageTitle = "text-xl font-semibold text-ink";
