import { AgingScreen } from "../../../../components/screens/billing/AgingScreen";

export default AgingScreen;
