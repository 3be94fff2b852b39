import { describe, expect, it } from "vitest";
import { firstValues, listSearch, readListAddress } from "@/lib/lists/list-address";
import { jobListQuerySchema } from "@/lib/schemas/job";

const defaults = { q: "", status: "", sort: "updated_desc", mine: "0" };

describe("list addresses", () => {
  it("leaves out filters at their defaults and the first page", () => {
    expect(listSearch(defaults, defaults)).toBe("");
    expect(listSearch(defaults, defaults, 1)).toBe("");
  });

  it("writes changed filters, trimmed and encoded, then the page", () => {
    expect(listSearch({ ...defaults, q: "  Crane & Sons ", mine: "1" }, defaults, 3)).toBe("?q=Crane+%26+Sons&mine=1&page=3");
    expect(listSearch({ ...defaults, q: "   " }, defaults)).toBe("");
  });

  it("round-trips through the jobs query schema the API uses", () => {
    const search = listSearch({ q: "brook", status: "cancelled", sort: "customer_asc", mine: "0" }, defaults, 2);
    const params = new URLSearchParams(search);
    const parsed = jobListQuerySchema.parse(firstValues(Object.fromEntries(params.entries())));
    expect(parsed).toMatchObject({ q: "brook", status: "cancelled", sort: "customer_asc", page: 2, mine: "0", pageSize: 20 });
  });

  it("takes the first of repeated parameters and skips missing ones", () => {
    expect(firstValues({ q: ["a", "b"], status: undefined, sort: "customer_asc" })).toEqual({ q: "a", sort: "customer_asc" });
  });
});

describe("readListAddress", () => {
  it("a readable address gives its query and no problem; an unreadable one the defaults and the schema's message", () => {
    expect(readListAddress(jobListQuerySchema, { q: ["brook", "ignored"], status: "completed" })).toMatchObject({ query: { q: "brook", status: "completed", page: 1 }, problem: null });
    const bad = readListAddress(jobListQuerySchema, { q: "x".repeat(101), status: "completed" });
    expect(bad.query).toEqual(jobListQuerySchema.parse({}));
    expect(bad.problem).toBe("Search for at most 100 characters.");
  });

  it("every unreadable filter is named with what it may be", () => {
    expect(readListAddress(jobListQuerySchema, { status: "nope" }).problem).toBe("The status must be one of scheduled, in_progress, awaiting_review, completed, cancelled, or left out for all.");
    expect(readListAddress(jobListQuerySchema, { page: "two" }).problem).toBe("The page must be a whole number from 1.");
    expect(readListAddress(jobListQuerySchema, { mine: "yes" }).problem).toBe("Assigned to me is 1 (yes) or 0 (no).");
  });
});
