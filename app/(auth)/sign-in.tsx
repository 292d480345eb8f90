import { SignInScreen } from "../../components/screens/auth/SignInScreen";

export default SignInScreen;
