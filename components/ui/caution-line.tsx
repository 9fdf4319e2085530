/** The product's standing caution (BRIEF.md, "Cautions the product shows"), shown in page footers. */
export function CautionLine({ className = "" }: { className?: string }) {
  return (
    <p className={`text-xs leading-relaxed text-ink-faint ${className}`}>
      Statements are only as good as the meters behind them. Check figures against the regulations that apply to your site
      and have them verified where the rules require an accredited verifier; Synledger does not replace licensed engineering
      judgement or local codes. Ammonia, hydrogen and high-pressure synthesis are hazardous: Synledger computes balances and
      reports and never gives operating instructions.
    </p>
  );
}
