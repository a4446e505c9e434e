// The commercial side of a published spec as shops read it, from the quotation answers frozen
// into its revision (strings as the buyer typed them, already checked at publishing).

export interface QuotationFacts {
  unitsWanted: string | null;
  dateNeeded: string | null;
  deliveryRegion: string | null;
  currency: string | null;
  retainerPercent: string | null;
  notes: string | null;
}

const present = (value: unknown) => (typeof value === "string" && value.trim() !== "" ? value.trim() : null);

export function quotationFacts(answers: Record<string, Record<string, string>> | null | undefined): QuotationFacts {
  const q = answers?.quotation ?? {};
  return {
    unitsWanted: present(q.unitsWanted),
    dateNeeded: present(q.dateNeeded),
    deliveryRegion: present(q.deliveryRegion),
    // Specs published before the currency was asked are quoted in euros.
    currency: present(q.currency) ?? "EUR",
    retainerPercent: present(q.retainerPercent),
    notes: present(q.notes),
  };
}
