// postcss-filter-rules ships no types; the part of its API vite.config.ts uses.
declare module 'postcss-filter-rules' {
  import type { PluginCreator } from 'postcss';

  const filterRules: PluginCreator<{
    /** Keep the selector when true; a rule with no selector left is removed. */
    filter: (selector: string, parts: string[]) => boolean;
  }>;
  export default filterRules;
}
