import { Callout, Intent } from '@blueprintjs/core';

/** A message for the whole form (one that belongs to no single field). */
export function FormError({ message }: { message: string | null | undefined }) {
  if (!message) return null;
  return (
    <Callout intent={Intent.WARNING} role="alert" className="wb-form-error">
      {message}
    </Callout>
  );
}
