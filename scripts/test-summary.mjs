// Reads Vitest's and Playwright's JSON reports and prints one plain closing line:
// "N passed, N failed". A missing report (a runner that crashed) counts as one failure.
import fs from "node:fs";

const [unitPath, e2ePath, buildStatus, opsPath] = process.argv.slice(2);
let passed = 0;
let failed = 0;
let skipped = 0;

function read(path) {
  try {
    return JSON.parse(fs.readFileSync(path, "utf8"));
  } catch {
    return null;
  }
}

const unit = read(unitPath);
if (unit) {
  passed += unit.numPassedTests ?? 0;
  failed += unit.numFailedTests ?? 0;
  skipped += (unit.numPendingTests ?? 0) + (unit.numTodoTests ?? 0);
  if (unit.numFailedTestSuites) failed += unit.testResults.filter((s) => s.status === "failed" && s.assertionResults.length === 0).length;
} else {
  console.log(`unit report missing: ${unitPath}`);
  failed += 1;
}

if (buildStatus && buildStatus !== "0") {
  console.log("production build failed");
  failed += 1;
} else {
  const e2e = read(e2ePath);
  if (e2e?.stats) {
    passed += (e2e.stats.expected ?? 0) + (e2e.stats.flaky ?? 0);
    failed += e2e.stats.unexpected ?? 0;
    skipped += e2e.stats.skipped ?? 0;
    if ((e2e.errors ?? []).length) failed += e2e.errors.length;
    // A test that passed only on its retry counts as passed, but is named, so a flake stays visible.
    const flaky = [];
    const walk = (suite, path) => {
      for (const spec of suite.specs ?? []) for (const t of spec.tests ?? []) if (t.status === "flaky") flaky.push(`[${t.projectName}] ${[...path, spec.title].join(" › ")}`);
      for (const child of suite.suites ?? []) walk(child, [...path, child.title].filter(Boolean));
    };
    for (const suite of e2e.suites ?? []) walk(suite, [suite.title]);
    for (const title of flaky) console.log(`flaky (failed, then passed on its retry): ${title}`);
  } else {
    console.log(`end-to-end report missing: ${e2ePath}`);
    failed += 1;
  }
}

if (opsPath && (!buildStatus || buildStatus === "0")) {
  let lines = [];
  try {
    lines = fs.readFileSync(opsPath, "utf8").split("\n").filter(Boolean);
  } catch {
    lines = [];
  }
  for (const line of lines) {
    if (line.endsWith(" pass")) passed += 1;
    else failed += 1;
  }
}

console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ""}`);
process.exit(failed > 0 ? 1 : 0);
