import type { SVGProps } from "react";

/* Small line icons drawn for Synledger; decorative, so hidden from assistive technology. */
type IconProps = SVGProps<SVGSVGElement>;

function Svg({ children, ...props }: IconProps) {
  return (
    <svg
      viewBox="0 0 16 16"
      width="1em"
      height="1em"
      fill="none"
      stroke="currentColor"
      strokeWidth={1.5}
      strokeLinecap="round"
      strokeLinejoin="round"
      aria-hidden="true"
      focusable="false"
      {...props}
    >
      {children}
    </svg>
  );
}

/** The product mark: a level beam on a pivot, the balance closing at zero. */
export function BeamMark(props: IconProps) {
  return (
    <Svg {...props}>
      <path d="M2 6h12" />
      <path d="M8 6v6" />
      <path d="M5.5 13h5" />
      <path d="M3.5 6 2 9.5h3L3.5 6Z" />
      <path d="M12.5 6 11 9.5h3L12.5 6Z" />
    </Svg>
  );
}

export function CheckIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <circle cx="8" cy="8" r="6.25" />
      <path d="m5.25 8.25 1.9 1.9 3.6-4.1" />
    </Svg>
  );
}

export function WarnIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <path d="M8 2.25 14.25 13.5H1.75L8 2.25Z" />
      <path d="M8 6.5v3" />
      <path d="M8 11.6v.01" />
    </Svg>
  );
}

export function FaultIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <circle cx="8" cy="8" r="6.25" />
      <path d="m5.75 5.75 4.5 4.5M10.25 5.75l-4.5 4.5" />
    </Svg>
  );
}

export function InfoIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <circle cx="8" cy="8" r="6.25" />
      <path d="M8 7.25v4" />
      <path d="M8 4.9v.01" />
    </Svg>
  );
}

export function PendingIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <circle cx="8" cy="8" r="6.25" strokeDasharray="2.4 1.6" />
      <path d="M8 5v3.25l2 1.25" />
    </Svg>
  );
}

export function LockIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <rect x="3.25" y="7" width="9.5" height="6.75" rx="1" />
      <path d="M5.25 7V5a2.75 2.75 0 0 1 5.5 0v2" />
    </Svg>
  );
}

export function ArrowLeftIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <path d="M13 8H3" />
      <path d="M7 4 3 8l4 4" />
    </Svg>
  );
}
