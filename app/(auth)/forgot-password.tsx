import { ForgotPasswordScreen } from "../../components/screens/auth/ForgotPasswordScreen";

export default ForgotPasswordScreen;
