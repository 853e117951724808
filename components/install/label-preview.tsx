import { labelArtwork, type LabelRequirement } from "@/lib/labels";

const css = (c: { r: number; g: number; b: number }) => `rgb(${Math.round(c.r * 255)} ${Math.round(c.g * 255)} ${Math.round(c.b * 255)})`;

/** The label as it prints: the ANSI Z535.4 signal-word panel over the message, from the same artwork model as the PDF. */
export function LabelPreview({ label }: { label: LabelRequirement }) {
  const art = labelArtwork(label);
  return (
    <figure className="w-full max-w-[22rem] border-2 border-black bg-white text-black" aria-label={`${art.signalWord}: ${art.title}`}>
      <div className="flex items-center justify-center gap-2 px-2 py-1 text-lg font-bold tracking-wide" style={{ background: css(art.header.background), color: css(art.header.text) }}>
        {art.header.alertSymbol ? <span aria-hidden="true">⚠</span> : null}
        {art.signalWord}
      </div>
      <figcaption className="px-3 py-2 text-center text-[13px] leading-snug">
        <p className="font-bold uppercase">{art.title}</p>
        {art.lines.map((line, i) => (
          <p key={i} className="figure">
            {line}
          </p>
        ))}
      </figcaption>
    </figure>
  );
}
