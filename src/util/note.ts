/**
 * A note a stage hands to later stages and the report: `kind` says what it is about (stable, for
 * code to choose on), `text` says it in words (for people). Later stages choose by `kind` and
 * show `text`; they never read the words.
 */
export interface Note<K extends string = string> {
  kind: K;
  text: string;
}
