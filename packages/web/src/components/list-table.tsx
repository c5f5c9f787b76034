import { Cell, Column, SelectionModes, Table2, type ColumnProps } from '@blueprintjs/table';
import { ResizeSensor } from '@blueprintjs/table/lib/esm/interactions/resizeSensor';
import '@blueprintjs/table/lib/css/table.css';
import type { DependencyList, ReactElement, ReactNode } from 'react';

export { TABLE_FITS_QUERY, useTableFits } from './table-fits';

const HEADER_HEIGHT = 30;
/** One pixel of border on each side. */
const BORDERS = 2;

// The table watches its own size with an old polyfill that writes style="" attributes through
// innerHTML, which the strict CSP refuses (four style-src-attr reports per table). Browsers have
// ResizeObserver for this; the table only needs its callback when its size changes.
if (typeof ResizeObserver !== 'undefined') {
  ResizeSensor.attach = (element: HTMLElement, callback: () => void) => {
    const observer = new ResizeObserver(() => callback());
    observer.observe(element);
    return () => observer.disconnect();
  };
}

/**
 * A read-only list as a Blueprint table, sized to all its rows so the page scrolls
 * rather than the table: `<ListTable label="Students" rowHeight={44} …>{columns}</ListTable>`.
 */
export function ListTable({
  label,
  className,
  numRows,
  rowHeight,
  columnWidths,
  dependencies,
  children,
}: {
  label: string;
  /** Added to `wb-table`. */
  className?: string;
  numRows: number;
  rowHeight: number;
  columnWidths: number[];
  /** What the cell renderers read, so the cells draw again when it changes. */
  dependencies: DependencyList;
  children: ReactElement<ColumnProps> | ReactElement<ColumnProps>[];
}) {
  const width = columnWidths.reduce((sum, w) => sum + w, 0);
  return (
    <div
      className={className ? `wb-table ${className}` : 'wb-table'}
      style={{
        height: HEADER_HEIGHT + numRows * rowHeight + BORDERS,
        width: width + BORDERS,
      }}
      aria-label={label}
      role="region"
    >
      <Table2
        numRows={numRows}
        defaultRowHeight={rowHeight}
        columnWidths={columnWidths}
        enableRowHeader={false}
        enableFocusedCell={false}
        enableColumnResizing={false}
        enableRowResizing={false}
        enableGhostCells={false}
        selectionModes={SelectionModes.NONE}
        cellRendererDependencies={dependencies}
      >
        {children}
      </Table2>
    </div>
  );
}

/** The last column of an editable list: each row's buttons, drawn by `render`. */
export function actionsColumn<T>(
  rows: readonly T[],
  render: (row: T) => ReactNode,
): ReactElement<ColumnProps> {
  return (
    <Column
      key="actions"
      name="Actions"
      cellRenderer={(index) => {
        const row = rows[index];
        return (
          <Cell interactive className="wb-cell-actions">
            {row === undefined ? null : render(row)}
          </Cell>
        );
      }}
    />
  );
}
