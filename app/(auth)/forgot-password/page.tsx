import { AuthFrame, bigLink } from "@/components/account/auth-frame";
import { ForgotForm } from "@/components/account/forgot-form";

export const metadata = { title: "Forgot password" };

export default function ForgotPasswordPage() {
  return (
    <AuthFrame title="Forgot your password?">
      <p className="text-muted">
        Type the e-mail you sign in with. We send a link where you choose a new password; it works once, for one hour.
      </p>
      <ForgotForm />
      <a href="/sign-in" className={bigLink}>
        Back to sign-in
      </a>
    </AuthFrame>
  );
}
