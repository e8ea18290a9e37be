export function HomeRoute() {
  return (
    <section className="space-y-4">
      <h1 className="text-2xl font-semibold">Find the smaller network your model behaves like</h1>
      <p className="max-w-3xl text-slate-600">
        Emulant analyses Boolean models of regulatory networks: their attractors and basins, how knock-outs change them,
        and which smaller networks they emulate or coarse-grain onto. Every reduction comes with a certificate that
        anyone can re-verify.
      </p>
    </section>
  );
}
