/**
 * Placeholder until the per-stage form lands (engineer B owns this file and replaces it): renders
 * nothing, so the chain editor can show the form area around it.
 */
export function StageForm({ elementId }: { elementId: string }) {
  void elementId;
  return null;
}
