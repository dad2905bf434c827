/**
 * A recommendation is plain text with two kinds of block: paragraphs (separated by a blank line)
 * and lists (lines starting with "- " or "* "). It is never treated as HTML: the client renders
 * the blocks as React text, the sign-off sheet as PDF text and e-mails as escaped text.
 *
 * parseRecommendation('We suggest B.\n\n- least area error\n- familiar shape')
 *   → [{ kind: 'paragraph', text: 'We suggest B.' }, { kind: 'list', items: ['least area error', 'familiar shape'] }]
 */
export type RecommendationBlock = { kind: 'paragraph'; text: string } | { kind: 'list'; items: string[] };

const ITEM = /^\s*[-*]\s+(.*)$/;

export function parseRecommendation(text: string): RecommendationBlock[] {
  const blocks: RecommendationBlock[] = [];
  let paragraph: string[] = [];
  let items: string[] | null = null;
  const flushParagraph = () => {
    if (paragraph.length) blocks.push({ kind: 'paragraph', text: paragraph.join(' ') });
    paragraph = [];
  };
  const flushList = () => {
    if (items?.length) blocks.push({ kind: 'list', items });
    items = null;
  };
  for (const raw of text.replace(/\r\n?/g, '\n').split('\n')) {
    const line = raw.trim();
    const item = ITEM.exec(raw);
    if (!line) {
      flushParagraph();
      flushList();
    } else if (item) {
      flushParagraph();
      (items ??= []).push(item[1].trim());
    } else if (items && /^\s{2,}/.test(raw)) {
      // An indented line continues the list item above it.
      items[items.length - 1] += ` ${line}`;
    } else {
      flushList();
      paragraph.push(line);
    }
  }
  flushParagraph();
  flushList();
  return blocks;
}

/** The blocks as plain text again (e-mails, the PDF's fallback), with "• " bullets. */
export function recommendationAsText(text: string): string {
  return parseRecommendation(text)
    .map((b) => (b.kind === 'paragraph' ? b.text : b.items.map((i) => `• ${i}`).join('\n')))
    .join('\n\n');
}
