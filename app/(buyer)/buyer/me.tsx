import { ProfileScreen } from "../../../components/screens/common/ProfileScreen";

export default ProfileScreen;
