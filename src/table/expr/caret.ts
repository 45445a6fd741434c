import { SurmiseError, type ErrorCode } from '../../errors.ts';

/** Most characters of the expression shown around the caret; a longer one is cut with '…'. */
const WINDOW = 120;

/**
 * The expression on one line and a caret line under [pos, end): the message's second and third
 * lines. Tabs, line breaks and other control characters are shown as spaces so the caret stays
 * aligned; an expression longer than 120 characters is shown cut to a window around the place.
 */
export function caretBlock(source: string, pos: number, end = pos + 1): string {
  let shown = source.replace(/[\u0000-\u001f\u007f]/g, ' ');
  let at = pos;
  let width = Math.max(1, Math.min(end, shown.length + 1) - pos);
  if (shown.length > WINDOW) {
    width = Math.min(width, WINDOW / 2);
    const from = Math.max(0, Math.min(pos - WINDOW / 4, shown.length - WINDOW));
    const to = Math.min(shown.length, from + WINDOW);
    shown = (from > 0 ? '…' : '') + shown.slice(from, to) + (to < shown.length ? '…' : '');
    at = pos - from + (from > 0 ? 1 : 0);
  }
  return `  ${shown}\n  ${' '.repeat(at)}${'^'.repeat(width)}`;
}

/**
 * A SurmiseError about the expression `source` at 0-based `pos`: the first line stands alone
 * (it names the 1-based position), then the expression and a caret under the place.
 * When the source text is unknown (an Expr built by hand) only the first line is given.
 */
export function exprError(
  code: ErrorCode,
  firstLine: string,
  source: string | undefined,
  pos: number,
  end = pos + 1,
  details: Record<string, unknown> = {},
): SurmiseError {
  const body = source === undefined ? firstLine : `${firstLine}\n${caretBlock(source, pos, end)}`;
  return new SurmiseError(code, body, { ...details, position: pos + 1, expression: source });
}
