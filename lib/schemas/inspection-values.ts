/** Review sections, their labels and the queue sorts, without any validation code (see ./inspection). */
export const REVIEW_SECTIONS = ["general", "appliances", "ventRun", "airSpace", "returnAir", "readings", "siteChecks", "photos", "justifications"] as const;
export type ReviewSection = (typeof REVIEW_SECTIONS)[number];

export const REVIEW_SECTION_LABELS = {
  general: "General",
  appliances: "Appliances",
  ventRun: "Vent run",
  airSpace: "Combustion air",
  returnAir: "Return air",
  readings: "Readings",
  siteChecks: "Site checks",
  photos: "Photos",
  justifications: "Justifications",
} as const satisfies Record<ReviewSection, string>;

export const INSPECTION_QUEUE_SORTS = ["submitted_asc", "submitted_desc", "customer_asc", "installer_asc"] as const;
