import { NotFoundScreen } from "../components/screens/common/NotFoundScreen";

export default NotFoundScreen;
