import { describe, expect, it } from 'vitest';
import { roleWithArticle } from './role-text.ts';

describe('roleWithArticle', () => {
  it('chooses the article by sound of the label', () => {
    expect(roleWithArticle('observer')).toBe('an observer');
    expect(roleWithArticle('modeller')).toBe('a modeller');
    expect(roleWithArticle('admin')).toBe('an admin');
  });
});
