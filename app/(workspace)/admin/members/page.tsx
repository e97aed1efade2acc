export const metadata = { title: 'Members' };

export default function MembersPage() {
  return (
    <section aria-labelledby="members-heading">
      <h1 id="members-heading" className="text-title">Members</h1>
      <p className="mt-2 text-ink-600">Invite colleagues, change their roles, deactivate accounts.</p>
    </section>
  );
}
