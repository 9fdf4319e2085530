/**
 * When a meter's calibration falls due, from its last calibration date and the interval the site
 * set for it (its own rule: the regulation or the site's procedure decides, not Synledger).
 * Pure dates as "YYYY-MM-DD" (UTC).
 */
export interface CalibratedMeter {
  key: string;
  name: string;
  meterTag: string | null;
  calibratedOn: string | null;
  calibrationIntervalMonths: number | null;
}

/** calibratedOn + interval, same day of month (clamped to the month's last day). */
export function calibrationDueOn(calibratedOn: string, months: number): string {
  const [y, m, d] = calibratedOn.split("-").map(Number);
  const target = new Date(Date.UTC(y, m - 1 + months, 1));
  const last = new Date(Date.UTC(target.getUTCFullYear(), target.getUTCMonth() + 1, 0)).getUTCDate();
  target.setUTCDate(Math.min(d, last));
  return target.toISOString().slice(0, 10);
}

export interface Overdue {
  meter: CalibratedMeter;
  dueOn: string;
}

/** The meters whose calibration was due before `day` (for a month: its last day; for today: today). */
export function overdueMeters(meters: readonly CalibratedMeter[], day: string): Overdue[] {
  return meters.flatMap((m) => {
    if (!m.calibratedOn || !m.calibrationIntervalMonths) return [];
    const dueOn = calibrationDueOn(m.calibratedOn, m.calibrationIntervalMonths);
    return dueOn < day ? [{ meter: m, dueOn }] : [];
  });
}
