import { useStdout } from 'ink';
import { useEffect, useState } from 'react';

/** Terminal size in cells. */
export interface ScreenSize {
  columns: number;
  rows: number;
}

/**
 * The terminal size, updated on resize. `fixed` (tests) overrides the terminal. A stream without a
 * size (not a terminal) reads as 80x24.
 */
export function useScreenSize(fixed?: ScreenSize): ScreenSize {
  const { stdout } = useStdout();
  const read = (): ScreenSize => fixed ?? { columns: stdout.columns || 80, rows: stdout.rows || 24 };
  const [size, setSize] = useState(read);
  useEffect(() => {
    if (fixed) return undefined;
    const onResize = () => setSize(read());
    stdout.on('resize', onResize);
    return () => {
      stdout.off('resize', onResize);
    };
  }, [stdout, fixed?.columns, fixed?.rows]);
  return fixed ?? size;
}
