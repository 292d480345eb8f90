import { SignedOutLayout } from "@/components/auth/SignedOutLayout";

export default SignedOutLayout;
