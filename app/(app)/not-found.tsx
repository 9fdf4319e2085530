import Link from "next/link";
import { link } from "@/components/ui/styles";

/** Also answers for other organisations' records, so their existence is never revealed. */
export default function AppNotFound() {
  return (
    <div className="max-w-prose space-y-3">
      <h1 className="text-xl font-semibold">Not found</h1>
      <p className="text-ink-soft">
        There is no such page, site or month in your organisation. The link may be mistyped, or the record may belong to an
        organisation you are not a member of.
      </p>
      <p className="flex gap-4">
        <Link href="/" className={link}>
          Back to the overview
        </Link>
        <Link href="/months" className={link}>
          Monthly ledger
        </Link>
      </p>
    </div>
  );
}
