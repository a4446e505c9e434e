// The commercial side of a published spec as shops read it, from the quotation answers frozen
// into its revision (strings as the buyer typed them, already checked at publishing).

export interface QuotationFacts {
  /** what the machine does, in the buyer's words */
  purpose: string | null;
  supplyVoltage: string | null;
  fluid: string | null;
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
  const machine = answers?.machine ?? {};
  const duty = answers?.duty ?? {};
  return {
    purpose: present(machine.purpose),
    supplyVoltage: present(duty.supplyVoltage),
    fluid: present(duty.fluid),
    unitsWanted: present(q.unitsWanted),
    dateNeeded: present(q.dateNeeded),
    deliveryRegion: present(q.deliveryRegion),
    // Specs published before the currency was asked are quoted in euros.
    currency: present(q.currency) ?? "EUR",
    retainerPercent: present(q.retainerPercent),
    notes: present(q.notes),
  };
}
