// The release of the safety rules. Raise it whenever a rule's logic or wording changes what it flags:
// every workshop's cars are re-checked once against the new release (docs/fleet.md).
export const RULES_RELEASE = 1
