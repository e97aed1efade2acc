import { ShareRefusal } from '@/components/share/ShareRefusal';

export default function ShareNotFound() {
  return <ShareRefusal state="invalid" />;
}
