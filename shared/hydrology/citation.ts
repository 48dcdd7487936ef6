/**
 * How the product cites a value that could not be checked against a public copy of its
 * document: tests keep "from memory"; screens, sheets and exports say this instead of a tag.
 */
export const AS_REPRODUCED = "value as commonly reproduced; confirm against the agency's edition";
