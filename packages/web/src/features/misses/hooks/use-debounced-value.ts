import { useEffect, useState } from 'react';

/** `useDebouncedValue(text, 200)` → `text` once it has stayed the same for 200 ms. */
export function useDebouncedValue<T>(value: T, delay: number): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setSettled(value), delay);
    return () => clearTimeout(timer);
  }, [value, delay]);
  return settled;
}
