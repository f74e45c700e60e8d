/** What a non-admin sees instead of the outbox: mail holds other people's links and addresses. */
export function AdminsOnly() {
  return (
    <div role="alert" className="rounded-lg border border-mat-600 bg-mat-900/80 px-5 py-6 text-center">
      <h2 className="text-sm font-semibold text-slate-100">Admins only</h2>
      <p className="mt-1 text-sm text-slate-400">
        The outbox holds other people's invitation and password links, so only site admins can read it.
      </p>
    </div>
  );
}
