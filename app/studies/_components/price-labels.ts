/** How the study pages name the origin of a price (what lib/services/studies.ts chose and why). */
import type { HydrogenMeta, PriceSource, QuoteChoice } from "@/lib/services/studies";

function baseLabel(p: PriceSource): string {
  switch (p.kind) {
    case "quote":
      return `quote #${p.quoteId} of ${p.validFrom}`;
    case "current":
      return `quote #${p.quoteId} of ${p.validFrom} (rule: ${p.rule})`;
    case "components":
      return `components' quotes mixed per kg (rule: ${p.rule})`;
    case "none":
      return `no cost: no usable quote in ${p.currency} (rule: ${p.rule})`;
  }
}

/** The price's origin, its rule, and what happened on the way (corrections, withdrawals, conversions). */
export function priceSourceLabel(p: PriceSource): string {
  const notes = p.notes ?? [];
  return notes.length ? `${baseLabel(p)}; ${notes.join("; ")}` : baseLabel(p);
}

/** The price source with its label, as the API answers it. */
export function labelledPriceSource(p: PriceSource): PriceSource & { label: string } {
  return { ...p, label: priceSourceLabel(p) };
}

/** Where the hydrogen sweep's hydrogen price comes from. */
export function hydrogenPriceLabel(h: HydrogenMeta): string {
  if (h.price.kind === "none")
    return h.fuelName
      ? `${h.fuelName} has no quote in ${h.price.currency}`
      : "no hydrogen chosen for the study (its settings: hydrogen for the sweep)";
  return `${h.fuelName ?? "hydrogen"}: ${priceSourceLabel(h.price)}`;
}

/** A quote as the study form offers it: amount (+ adders), currency per unit and basis, valid-from date. */
export function quoteChoiceLabel(q: QuoteChoice): string {
  const per = q.unit === "m3" ? `m³ (${q.meteringReference ?? "?"})` : q.energyBasis ? `${q.unit} ${q.energyBasis}` : q.unit;
  const adders = q.transportAdder || q.handlingAdder ? ` + ${q.transportAdder + q.handlingAdder} adders` : "";
  return `${q.amount}${adders} ${q.currency}/${per}, from ${q.validFrom}`;
}
