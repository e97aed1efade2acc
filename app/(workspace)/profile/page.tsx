import { notFound } from 'next/navigation';
import { ProfileForm } from '@/components/auth/ProfileForm';
import { getProfessionalProfile } from '@/db/queries/profile';
import { saveProfessionalProfileAction } from '@/server/auth/profileActions';
import { requirePageUser } from '@/server/auth/session';

export const dynamic = 'force-dynamic';

/** The signed-in person's own profile: name and e-mail as the team knows them, and the licence a reviewer signs with. */
export default async function ProfilePage() {
  const user = await requirePageUser();
  const profile = await getProfessionalProfile(user.teamId, user.id);
  if (!profile) notFound();
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-title font-semibold">Your profile</h1>
        <p className="text-body text-ink-600">
          {profile.name} · {profile.email}
        </p>
        <p className="mt-1 max-w-2xl text-body text-ink-700">
          A sheet you approve prints your name with the licence or registration below and its jurisdiction, above the signature and stamp area of its calculation package.
        </p>
      </div>
      <ProfileForm initial={{ licenceNumber: profile.licenceNumber, licenceJurisdiction: profile.licenceJurisdiction }} onSave={saveProfessionalProfileAction} />
    </div>
  );
}
