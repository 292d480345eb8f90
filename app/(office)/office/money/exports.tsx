import { ExportsScreen } from "../../../../components/screens/billing/ExportsScreen";

export default ExportsScreen;
