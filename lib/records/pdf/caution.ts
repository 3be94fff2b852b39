/**
 * The record's cautions, in one place so that the PDF and its tests share the wording. The
 * record never says the installation is safe: it reports checks against the company's tables.
 */
export const CAUTION_TITLE = "Caution: what this record is, and what it is not";

export const CAUTION_GOVERNS =
  "The locally adopted code, the authority having jurisdiction and the appliance manufacturer's installation instructions govern this installation. This record reports checks of the work against the company's stated tables (its rulebook). It is not a substitute for a licensed inspection, and venting and combustion-air work must be done and verified by a licensed professional.";

export const CAUTION_PASS_MEANING =
  "PASS means only that the value entered on site meets the company's table; WARNING, NEEDS INFO and FAIL items are explained in the findings.";

export const CAUTION_CO =
  "Carbon monoxide and spillage: if a CO alarm sounds, anyone feels unwell, you smell gas or see flue gases spilling from the appliance, stop. Make the appliance safe (turn it off if you can do so without risk), ventilate, leave the home and call the gas utility or emergency services. Do not use the appliance again until a qualified technician has checked it.";

/** The short caution in the footer of every page. */
export const FOOTER_CAUTION =
  "Local code, the authority having jurisdiction and the manufacturer's instructions govern; this record does not replace a licensed inspection. CO alarm, gas smell or spillage: stop, make the appliance safe, ventilate, get help.";
