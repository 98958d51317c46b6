/** The usual caution wherever legal limits are shown. */
export function LegalCaution() {
  return (
    <p role="note" className="rounded-md border border-ochre-700/30 bg-ochre-50 px-4 py-2 text-sm text-ochre-700">
      Legal limits change. Cellarpact shows the limits of its market rule packs, with their sources, as a help: the law of the destination
      market in force at the time of sale prevails, and a result near a limit should be confirmed by an accredited laboratory.
    </p>
  );
}
