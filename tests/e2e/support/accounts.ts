import { DEMO_ACCOUNTS } from "../../fixtures/demo-accounts";

export { DEMO_ACCOUNTS };
export type DemoRole = keyof typeof DEMO_ACCOUNTS;
