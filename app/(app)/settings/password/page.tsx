import { requirePageUser } from "@/lib/authz/page";
import { Card, PageHeader } from "@/components/ui/page-header";
import { ChangePasswordForm } from "@/lib/auth/components/change-password-form";

export const metadata = { title: "Password" };

export default async function PasswordPage() {
  await requirePageUser("/settings/password");
  return (
    <>
      <PageHeader title="Settings → Password" description="Changing your password signs you out everywhere, including scripts' browser sessions; API tokens keep working until you revoke them." />
      <Card title="Change password">
        <ChangePasswordForm />
      </Card>
    </>
  );
}
