import Link from "next/link";
import { BeamMark } from "@/components/ui/icons";
import { link } from "@/components/ui/styles";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-md px-5 py-16">
      <p className="flex items-center gap-1.5 font-semibold text-ink">
        <BeamMark className="size-5 text-accent" /> Synledger
      </p>
      <h1 className="mt-6 text-xl font-semibold">Page not found</h1>
      <p className="mt-2 text-ink-soft">There is no page at this address. It may have been mistyped or moved.</p>
      <p className="mt-4">
        <Link href="/" className={link}>
          Go to the overview
        </Link>
      </p>
    </main>
  );
}
