import { describe, expect, it } from 'vitest';
import { parseRecommendation, recommendationAsText } from './recommendation.js';

describe('parseRecommendation', () => {
  it('splits paragraphs on blank lines and joins wrapped lines', () => {
    expect(parseRecommendation('First line\nwraps here.\n\nSecond.')).toEqual([
      { kind: 'paragraph', text: 'First line wraps here.' },
      { kind: 'paragraph', text: 'Second.' },
    ]);
  });

  it('reads "- " and "* " lines as one list, with indented continuation lines', () => {
    expect(parseRecommendation('Why:\n- least areal error\n  over the mainland\n* familiar shape\nThanks.')).toEqual([
      { kind: 'paragraph', text: 'Why:' },
      { kind: 'list', items: ['least areal error over the mainland', 'familiar shape'] },
      { kind: 'paragraph', text: 'Thanks.' },
    ]);
  });

  it('keeps markup as literal text', () => {
    const blocks = parseRecommendation('<script>alert(1)</script>\n- <b>bold</b>');
    expect(blocks[0]).toEqual({ kind: 'paragraph', text: '<script>alert(1)</script>' });
    expect(blocks[1]).toEqual({ kind: 'list', items: ['<b>bold</b>'] });
  });

  it('writes lists back with bullets', () => {
    expect(recommendationAsText('A\r\n\r\n- x\r\n- y')).toBe('A\n\n• x\n• y');
  });

  it('gives nothing for blank text', () => {
    expect(parseRecommendation(' \n\n ')).toEqual([]);
  });
});
