import { HomeRedirect } from "@/components/auth/HomeRedirect";

export default HomeRedirect;
