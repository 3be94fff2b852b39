import fs from "node:fs";
import path from "node:path";
import type { Knex } from "knex";
import sharp from "sharp";
import { STARTER_RULEBOOK } from "./data/starter-rulebook";
import { DEFAULT_SITE_CHECK_ITEMS } from "../../lib/site-checks/defaults";
import { prepareRulebook } from "../../lib/venting";
import { inspectionDataSchema, type InspectionData } from "../../lib/inspections/data";
import { evaluateInspectionData, findingKey, submissionBlockers } from "../../lib/inspections/evaluate";

/**
 * Demo inspections in each state of the workflow: an approved record, one waiting for review,
 * and a draft with problems still to fix. All names and numbers are the invented demo scenario.
 */
async function signaturePng(seed: number): Promise<string> {
  const points = Array.from({ length: 9 }, (_, i) => `${20 + i * 42},${60 + Math.round(Math.sin(i * 1.3 + seed) * 28)}`).join(" ");
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="400" height="120"><polyline points="${points}" fill="none" stroke="#1a2126" stroke-width="4" stroke-linecap="round" stroke-linejoin="round"/></svg>`;
  const png = await sharp(Buffer.from(svg)).png().toBuffer();
  return `data:image/png;base64,${png.toString("base64")}`;
}

function exampleData(): InspectionData {
  const example = JSON.parse(fs.readFileSync(path.join(process.cwd(), "docs/examples/check-request.json"), "utf8"));
  return inspectionDataSchema.parse({ appliances: example.appliances, ventRun: example.ventRun, airSpace: example.airSpace, readings: example.readings });
}

/**
 * The trade's most common replacement: a fan-assisted furnace and a draft-hood water heater on one
 * Type B vent, each with its own single-wall connector. Entered with the furnace's connector one
 * size too small for the demo tables, so the draft shows the smallest size that works.
 */
export function commonVentData(): InspectionData {
  const connector = { material: "single_wall", clearanceIn: 6, supportsInstalled: 1, fastenersPerJoint: 3, joints: 1, sectionsLocked: true, passesThrough: "none", turns45: 0 };
  return inspectionDataSchema.parse({
    appliances: [
      { id: "furnace", label: "Furnace (basement)", kind: "furnace", fuel: "natural_gas", inputBtuh: 100_000, category: "I", draft: "fan_assisted", outletDiameterIn: 4, listed: true, condensing: false },
      { id: "water-heater", label: "Water heater", kind: "water_heater", fuel: "natural_gas", inputBtuh: 40_000, category: "I", draft: "natural", outletDiameterIn: 3, listed: true, condensing: false },
    ],
    ventRun: {
      id: "vent-run",
      applianceIds: ["furnace", "water-heater"],
      segments: [
        { id: "furnace-up", applianceId: "furnace", ...connector, diameterIn: 4, lengthFt: 2, orientation: "vertical", turns90: 0 },
        { id: "furnace-across", applianceId: "furnace", ...connector, diameterIn: 4, lengthFt: 5, orientation: "horizontal", riseIn: 1.5, turns90: 1 },
        { id: "heater-up", applianceId: "water-heater", ...connector, diameterIn: 4, lengthFt: 1.5, orientation: "vertical", turns90: 0 },
        { id: "heater-across", applianceId: "water-heater", ...connector, diameterIn: 4, lengthFt: 3, orientation: "horizontal", riseIn: 1, turns90: 1 },
      ],
      vent: { material: "type_b", diameterIn: 5, heightFt: 18, lateralFt: 0, turns45: 0, turns90: 0, serves: "common", manifoldLengthFt: 0 },
      termination: { roofPitchPer12: 6, heightAboveRoofFt: 2, capSizeIn: 5, listedCap: true, distanceToVerticalWallFt: 12, nearbyOpenings: [] },
    },
    airSpace: {
      id: "air-space",
      applianceRoomId: "basement",
      rooms: [
        { id: "basement", label: "Basement utility room", lengthFt: 30, widthFt: 25, heightFt: 8 },
        { id: "rec-room", label: "Recreation room", lengthFt: 20, widthFt: 15, heightFt: 8, openToApplianceRoom: true },
      ],
      openings: [],
    },
    readings: [{ applianceId: "furnace" }, { applianceId: "water-heater" }],
    notes: "Existing water heater stays; new furnace joins the existing 5 in Type B vent.",
  });
}

export async function seed(knex: Knex): Promise<void> {
  const rulebook = prepareRulebook(STARTER_RULEBOOK);
  const items = DEFAULT_SITE_CHECK_ITEMS;
  const allYes = Object.fromEntries(items.map((i) => [i.key, { answer: "yes" as const, note: "" }]));
  const companies = await knex("companies").orderBy("id").select("id", "default_rulebook_id");

  for (const [companyIndex, company] of companies.entries()) {
    const version = await knex("rulebook_versions").where({ rulebook_id: company.default_rulebook_id }).orderBy("version_number", "desc").first("id");
    const installer = await knex("users").where({ company_id: company.id, role: "installer", active: true }).orderBy("id").first("id", "name");
    const supervisor = (await knex("users").where({ company_id: company.id, role: "supervisor" }).first("id", "name")) ?? (await knex("users").where({ company_id: company.id, role: "admin" }).first("id", "name"));
    const jobs = await knex("jobs").where({ company_id: company.id }).orderBy("reference").select("id", "reference", "status");
    const byStatus = (status: string) => jobs.find((j) => j.status === status);

    const insert = async (jobId: number, status: string, data: InspectionData, daysAgo: number) => {
      const evaluation = evaluateInspectionData(data, rulebook, items);
      const when = new Date(Date.now() - daysAgo * 86_400_000).toISOString();
      const signed = status !== "draft";
      const [row] = await knex("inspections")
        .insert({
          company_id: company.id,
          job_id: jobId,
          status,
          revision: 1,
          rulebook_version_id: version.id,
          data_json: JSON.stringify(data),
          findings_json: JSON.stringify(evaluation.findings),
          summary_json: JSON.stringify(evaluation.summary),
          version: 3,
          created_by: installer.id,
          installer_id: installer.id,
          installer_signed_name: signed ? installer.name : null,
          installer_signature_png: signed ? await signaturePng(companyIndex + 1) : null,
          submitted_at: signed ? when : null,
          approved_by: status === "approved" ? supervisor.id : null,
          supervisor_signed_name: status === "approved" ? supervisor.name : null,
          supervisor_signature_png: status === "approved" ? await signaturePng(companyIndex + 7) : null,
          approved_at: status === "approved" ? when : null,
          created_at: when,
          updated_at: when,
        })
        .returning("id");
      const id = typeof row === "object" ? row.id : row;
      await knex("inspections").where({ id }).update({ root_inspection_id: id });
      const audit = (action: string, summary: string, actor: { id: number; name: string }) =>
        knex("audit_events").insert({ company_id: company.id, actor_user_id: actor.id, actor_name: actor.name, action, entity_type: "inspection", entity_id: id, summary, created_at: when });
      await audit("inspection.draft_saved", "Draft saved", installer);
      if (signed) await audit("inspection.submitted", `Submitted for review, signed "${installer.name}"`, installer);
      if (status === "approved") await audit("inspection.approved", `Approved and signed "${supervisor.name}" (revision 1)`, supervisor);
    };

    // A fixed-up run: the slope corrected, a second support added, and the room opened to the next one.
    const fixed = exampleData();
    fixed.ventRun!.segments[1]!.riseIn = 2.5;
    fixed.ventRun!.segments[1]!.supportsInstalled = 2;
    fixed.ventRun!.segments[1]!.clearanceIn = 6;
    fixed.ventRun!.vent.diameterIn = 5;
    fixed.airSpace!.rooms[1]!.lengthFt = 24;
    fixed.airSpace!.rooms[1]!.widthFt = 16;
    fixed.airSpace!.openings[0]!.widthIn = 14;
    fixed.airSpace!.openings[0]!.heightIn = 12;
    fixed.siteChecks = allYes;
    fixed.notes = "Connector re-hung to rise toward the vent; clearance restored to 6 in; vent upsized to 5 in Type B; high grille to the recreation room enlarged.";
    const justify = (data: InspectionData) => {
      const blockers = submissionBlockers(evaluateInspectionData(data, rulebook, items).findings, {});
      data.justifications = Object.fromEntries(
        blockers.map((f) => [findingKey(f), { text: "Demo justification: accepted per the appliance manufacturer's venting instructions for this model.", reference: "Demo installation manual, venting section" }]),
      );
      return data;
    };

    const completed = byStatus("completed");
    if (completed) await insert(completed.id, "approved", justify(structuredClone(fixed)), 9);
    const waiting = byStatus("awaiting_review");
    if (waiting) await insert(waiting.id, "submitted", justify(structuredClone(fixed)), 2);
    const working = byStatus("in_progress");
    if (working) await insert(working.id, "draft", exampleData(), 0);
    const sharing = jobs.filter((j) => j.status === "in_progress")[1];
    if (sharing) await insert(sharing.id, "draft", commonVentData(), 0);
  }
}
