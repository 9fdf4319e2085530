export const ATTACHMENT_CATEGORIES = ["lab-certificate", "calibration-certificate", "invoice", "other"] as const;
export type AttachmentCategory = (typeof ATTACHMENT_CATEGORIES)[number];

export const CATEGORY_LABELS: Record<AttachmentCategory, string> = {
  "lab-certificate": "Lab certificate",
  "calibration-certificate": "Calibration certificate",
  invoice: "Invoice",
  other: "Other evidence",
};

export const MAX_ATTACHMENT_BYTES = 10 * 1024 * 1024;
