export const metadata = { title: 'Projects' };

export default function ProjectsPage() {
  return (
    <section aria-labelledby="projects-heading">
      <h1 id="projects-heading" className="text-title">Projects</h1>
      <p className="mt-2 text-ink-600">Sign in to see your team&apos;s projects and their sizing sheets.</p>
    </section>
  );
}
