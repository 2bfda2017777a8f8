/** A problem of the whole form, beside its buttons. */
export function FormError({ message }: { message: string | null | undefined }) {
  if (!message) return null;
  return (
    <p role="alert" className="text-sm font-medium text-diverged">
      {message}
    </p>
  );
}
