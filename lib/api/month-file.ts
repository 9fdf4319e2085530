/** Our download name: synledger-<site code>-<YYYY-MM>.plant-month.json, safe in any header or file system. */
export function exportFileName(siteCode: string, period: string): string {
  const code = siteCode.replace(/[^A-Za-z0-9_-]+/g, "-").replace(/^-+|-+$/g, "") || "site";
  return `synledger-${code}-${period}.plant-month.json`;
}
