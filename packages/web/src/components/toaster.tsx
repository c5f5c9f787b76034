import { Intent, OverlayToaster, Position } from '@blueprintjs/core';
import { createContext, useCallback, useContext, useMemo, useRef, type ReactNode } from 'react';

type Notify = (message: string, intent?: Intent) => void;

const ToastContext = createContext<Notify | null>(null);

/** One toaster in the tree, so results of saves and deletions show in the same place. */
export function ToasterProvider({ children }: { children: ReactNode }) {
  const toaster = useRef<OverlayToaster>(null);
  const notify = useCallback<Notify>((message, intent = Intent.SUCCESS) => {
    toaster.current?.show({ message, intent, timeout: 4000 });
  }, []);
  const value = useMemo(() => notify, [notify]);
  return (
    <ToastContext.Provider value={value}>
      {children}
      <OverlayToaster ref={toaster} position={Position.TOP} maxToasts={3} usePortal />
    </ToastContext.Provider>
  );
}

export function useToast(): Notify {
  const notify = useContext(ToastContext);
  if (!notify) throw new Error('useToast needs a ToasterProvider above it');
  return notify;
}
