import { z } from "zod";
import { idSchema } from "./common";
import { JOB_SORTS, JOB_STATUSES } from "./job-values";

export { JOB_SORTS, JOB_STATUSES, JOB_STATUS_LABELS, type JobSort, type JobStatus } from "./job-values";


const optionalText = (max: number, label: string) =>
  z.string().trim().max(max, `${label} can be at most ${max} characters.`).default("");

/** The job form: the same schema validates the browser form and the route handler. */
export const jobFormSchema = z.object({
  customerName: z.string({ error: "Enter the customer's name." }).trim().min(1, "Enter the customer's name.").max(200, "The name can be at most 200 characters."),
  customerPhone: optionalText(50, "The phone number").refine((v) => v === "" || /^[0-9+()\-.\s]{5,}$/.test(v), "Enter a phone number using digits, spaces, + ( ) - or ."),
  customerEmail: z
    .string()
    .trim()
    .toLowerCase()
    .max(254, "That e-mail address is too long.")
    .refine((v) => v === "" || z.email().safeParse(v).success, "Enter a valid e-mail address, like name@example.com, or leave it empty.")
    .default(""),
  siteStreet: z.string({ error: "Enter the street address of the site." }).trim().min(1, "Enter the street address of the site.").max(300, "The street address can be at most 300 characters."),
  siteCity: z.string({ error: "Enter the town or city." }).trim().min(1, "Enter the town or city.").max(120, "The town can be at most 120 characters."),
  siteRegion: optionalText(120, "The region"),
  sitePostalCode: optionalText(20, "The postal code"),
  status: z.enum(JOB_STATUSES, { error: "Choose a status from the list." }).default("scheduled"),
  assignedInstallerId: z.union([idSchema, z.null()]).default(null),
  scheduledFor: z
    .string()
    .trim()
    .refine((v) => v === "" || (/^\d{4}-\d{2}-\d{2}$/.test(v) && !Number.isNaN(Date.parse(v))), "Enter the date as YYYY-MM-DD, or leave it empty.")
    .default(""),
  notes: optionalText(5000, "Notes"),
});
export type JobFormInput = z.input<typeof jobFormSchema>;
export type JobFormValues = z.output<typeof jobFormSchema>;

export const jobUpdateSchema = jobFormSchema.extend({
  version: z.number({ error: "The job's version is missing; reload the page." }).int().positive(),
});
export type JobUpdateValues = z.output<typeof jobUpdateSchema>;

export const jobListQuerySchema = z.object({
  q: z.string().trim().max(100, "Search for at most 100 characters.").default(""),
  status: z.union([z.enum(JOB_STATUSES), z.literal("")], { error: `The status must be one of ${JOB_STATUSES.join(", ")}, or left out for all.` }).default(""),
  sort: z.enum(JOB_SORTS, { error: `The sort must be one of ${JOB_SORTS.join(", ")}.` }).default("updated_desc"),
  page: z.coerce.number({ error: "The page must be a whole number from 1." }).int("The page must be a whole number from 1.").min(1, "The page must be a whole number from 1.").max(100_000, "The page can be at most 100,000.").default(1),
  pageSize: z.coerce.number({ error: "The page size must be a whole number from 1 to 100." }).int("The page size must be a whole number from 1 to 100.").min(1, "The page size must be a whole number from 1 to 100.").max(100, "The page size must be a whole number from 1 to 100.").default(20),
  mine: z.enum(["0", "1"], { error: "Assigned to me is 1 (yes) or 0 (no)." }).default("0"),
});
export type JobListQuery = z.output<typeof jobListQuerySchema>;
