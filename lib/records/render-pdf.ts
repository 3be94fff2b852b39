import "server-only";

/**
 * The signed record's PDF, for the server alone (it reads the shipped fonts from disk). The
 * layout lives in ./pdf; see {@link renderRecordPdf}.
 */
export { renderRecordPdf } from "./pdf/render";
