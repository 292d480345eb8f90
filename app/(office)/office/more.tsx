import { MoreScreen } from "../../../components/screens/office/MoreScreen";

export default MoreScreen;
