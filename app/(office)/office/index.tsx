import { OfficeHome } from "../../../components/screens/office/OfficeHome";

export default OfficeHome;
