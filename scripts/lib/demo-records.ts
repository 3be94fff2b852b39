import { execFileSync } from "node:child_process";
import path from "node:path";

/**
 * Approved demo inspections get their PDF records from the same code the app uses. The data
 * modules are server-only, so the script runs under the react-server condition.
 */
export function issueDemoRecords(): void {
  execFileSync(process.execPath, ["--conditions=react-server", "--import", "tsx", path.join(process.cwd(), "scripts/issue-demo-records.ts")], { stdio: "inherit", env: process.env });
}
