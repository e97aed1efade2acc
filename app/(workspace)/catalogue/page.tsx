export const metadata = { title: 'Catalogue' };

export default function CataloguePage() {
  return (
    <section aria-labelledby="catalogue-heading">
      <h1 id="catalogue-heading" className="text-title">Catalogue</h1>
      <p className="mt-2 text-ink-600">Conductor materials, conductors and coverings shared by the team.</p>
    </section>
  );
}
