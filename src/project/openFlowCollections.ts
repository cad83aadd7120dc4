/**
 * The flow collections (`[` and `{`) still open at a character offset of YAML text, outermost
 * first, and the deepest nesting of flow collections met before that offset. Quoted scalars and
 * comments are skipped, so brackets inside them do not count.
 *
 * Used twice: before parsing, to refuse flow nesting deep enough to exhaust the parser's stack;
 * and after a syntax error inside an unclosed collection, to point at the line where the
 * collection opened rather than where the parser noticed (often the next key).
 *
 * Method: a single left-to-right scan with a stack of bracket offsets (YAML 1.2, sections 7.3
 * and 7.4: flow indicators, quoted scalars; section 6.6: a comment starts at `#` after white
 * space or at the start of a line). Plain scalars holding brackets (`a[b`) are rare in a project
 * file and would only shift the reported position, never hide an error.
 *
 * Syntax: openFlowCollections(text[, end])
 * Example: openFlowCollections('pwm:\n  driver: [30 ohm\n  duty: 1\n').open   // [14]
 */
export function openFlowCollections(text: string, end = text.length): { open: number[]; deepest: number } {
  const open: number[] = [];
  let deepest = 0;
  for (let i = 0; i < end; i++) {
    const ch = text[i];
    if (ch === '#' && (i === 0 || text[i - 1] === ' ' || text[i - 1] === '\t' || text[i - 1] === '\n')) {
      const eol = text.indexOf('\n', i);
      if (eol < 0) break;
      i = eol;
    } else if (ch === '"' || ch === "'") {
      // A quote opens a quoted scalar only where a scalar may start (after an indicator or space).
      const prev = i === 0 ? '\n' : text[i - 1];
      if (!' \t\n[{,:-?'.includes(prev)) continue;
      for (i++; i < end; i++) {
        if (ch === '"' && text[i] === '\\') i++;
        else if (text[i] === ch) {
          if (ch === "'" && text[i + 1] === "'") i++;
          else break;
        }
      }
    } else if (ch === '[' || ch === '{') {
      open.push(i);
      if (open.length > deepest) deepest = open.length;
    } else if ((ch === ']' || ch === '}') && open.length > 0) {
      open.pop();
    }
  }
  return { open, deepest };
}
