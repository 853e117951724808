/** Shown on every signed-in page: the checks assist, people decide. */
export function CautionBar() {
  return (
    <div role="note" className="border-t border-rule bg-brass-soft px-4 py-2 text-xs text-ink">
      <strong className="font-semibold">Caution:</strong> Sundocket&apos;s checks assist design and review; they do not approve
      anything. A licensed professional reviews and stamps each packet, and local codes and the Authority Having Jurisdiction
      govern. De-energise and verify before working on any circuit.
    </div>
  );
}
