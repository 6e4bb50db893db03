/** A piece of source: code, or non-code (a comment, a string literal, template-literal text, a regular-expression literal). */
export interface SourceSegment {
  text: string;
  code: boolean;
}
/** Splits source into code and non-code segments, in order; their texts concatenate to the source. */
export function segments(src: string): SourceSegment[];
