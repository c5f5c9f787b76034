import { Icons, IconSize, type IconName, type IconPaths } from '@blueprintjs/icons';
import chevronDown16 from '@blueprintjs/icons/lib/esm/generated/16px/paths/chevron-down';
import chevronDown20 from '@blueprintjs/icons/lib/esm/generated/20px/paths/chevron-down';

// Every icon the app draws is imported as a component (`<PlusIcon />`), so only what is used is
// bundled. Blueprint loads an icon by name only where a prop is left at a default that names one
// (a table header's menu: chevron-down); those few are listed here. Blueprint's own loader would
// fetch every icon's paths at once on the first such icon: two chunks of ~100 KB compressed.
const BY_NAME: Partial<Record<IconName, [IconPaths, IconPaths]>> = {
  'chevron-down': [chevronDown16, chevronDown20],
};

Icons.setLoaderOptions({
  loader: async (name, size) => {
    const paths = BY_NAME[name];
    // Blueprint reports a failed load on the console, which the browser tests watch.
    if (!paths) throw new Error(`"${name}" is not in src/lib/icons.ts: import it as a component`);
    return size === IconSize.STANDARD ? paths[0] : paths[1];
  },
});
