import { redirect } from "next/navigation";

export default async function OvenIndex({ params }: { params: Promise<{ ovenId: string }> }) {
  const { ovenId } = await params;
  redirect(`/ovens/${ovenId}/health`);
}
