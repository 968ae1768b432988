/** Safety cautions that apply to the fuels shown, with the screening statement. */
import type { Caution } from "@/lib/fuels/cautions";

export function Cautions({ items, screening, title = "Safety cautions" }: { items: Caution[]; screening: string; title?: string }) {
  return (
    <section aria-labelledby="cautions-h" className="keep">
      <h2 id="cautions-h">{title}</h2>
      <p className="note warn">{screening}</p>
      {items.length > 0 && (
        <div className="cautions">
          {items.map((c) => (
            <div className="caution" key={c.hazard}>
              <h3>{c.title}</h3>
              <p>{c.text}</p>
            </div>
          ))}
        </div>
      )}
    </section>
  );
}
