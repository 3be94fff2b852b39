"use client";

import dynamic from "next/dynamic";

/**
 * The review and record panels appear only on inspections that can no longer be edited
 * (submitted, returned, approved). Loading them as their own chunks keeps their code, and the
 * signature pad the review uses, off the draft editor's first load. They still render on the
 * server, so the page looks the same as soon as it arrives.
 */
export const ReviewPanel = dynamic(() => import("./review-panel").then((m) => m.ReviewPanel));
export const RecordPanel = dynamic(() => import("./record-panel").then((m) => m.RecordPanel));
