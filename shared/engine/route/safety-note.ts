/**
 * The advice every result carries, in a module of its own so the editor can show
 * it without loading the engine (which runs in the workers).
 */
export const PROCESS_SAFETY_NOTE =
  "These results are estimates from published models and the data entered. Cautions are prompts, not a hazard assessment: defer to the site's process-safety review, local codes and licensed practice before any operation, and confirm thermal and gas-evolution hazards by calorimetry.";
