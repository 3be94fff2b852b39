"use client";

import dynamic from "next/dynamic";

/**
 * The job's edit form sits in the closed "Job details" section. It still renders on the server
 * with the page, but its code (the form library and the shared job schema) comes in its own
 * chunk instead of with the page's first scripts.
 */
export const JobForm = dynamic(() => import("@/components/jobs/job-form").then((m) => m.JobForm));
