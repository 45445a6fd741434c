import { SurmiseError } from '../../errors.ts';

/**
 * The expression on one line and a caret line under [pos, end): the message's second and third
 * lines. Tabs and line breaks are shown as spaces so the caret stays aligned.
 */
export function caretBlock(source: string, pos: number, end = pos + 1): string {
  const shown = source.replace(/[\t\r\n\v\f]/g, ' ');
  const width = Math.max(1, Math.min(end, shown.length + 1) - pos);
  return `  ${shown}\n  ${' '.repeat(pos)}${'^'.repeat(width)}`;
}

/**
 * A SurmiseError about the expression `source` at 0-based `pos`: the first line stands alone
 * (it names the 1-based position), then the expression and a caret under the place.
 * When the source text is unknown (an Expr built by hand) only the first line is given.
 */
export function exprError(
  code: string,
  firstLine: string,
  source: string | undefined,
  pos: number,
  end = pos + 1,
  details: Record<string, unknown> = {},
): SurmiseError {
  const body = source === undefined ? firstLine : `${firstLine}\n${caretBlock(source, pos, end)}`;
  return new SurmiseError(code, body, { ...details, position: pos + 1, expression: source });
}
