package org.spectralsieve.api;

import org.apache.catalina.Container;
import org.apache.catalina.Valve;
import org.apache.catalina.core.StandardHost;
import org.apache.catalina.valves.ErrorReportValve;
import org.springframework.boot.tomcat.servlet.TomcatServletWebServerFactory;
import org.springframework.boot.web.server.WebServerFactoryCustomizer;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.core.Ordered;

/**
 * Puts {@link ProblemReportValve} where the container's HTML error report valve was, so that requests the
 * container refuses before the application sees them also get a problem detail. Runs after the framework's
 * own customizer, which installs the HTML valve, and replaces it.
 */
@Configuration
class ContainerErrorConfiguration {

    @Bean
    WebServerFactoryCustomizer<TomcatServletWebServerFactory> problemReportValve() {
        return new ProblemValveCustomizer();
    }

    private static final class ProblemValveCustomizer
            implements WebServerFactoryCustomizer<TomcatServletWebServerFactory>, Ordered {

        @Override
        public void customize(TomcatServletWebServerFactory factory) {
            factory.addContextCustomizers(context -> {
                Container host = context.getParent();
                if (host instanceof StandardHost standard) {
                    // the host adds a valve of this class at start when none is present, never the HTML one
                    standard.setErrorReportValveClass(ProblemReportValve.class.getName());
                }
                for (Valve valve : host.getPipeline().getValves()) {
                    if (valve instanceof ErrorReportValve && !(valve instanceof ProblemReportValve)) {
                        host.getPipeline().removeValve(valve);
                    }
                }
                boolean present = false;
                for (Valve valve : host.getPipeline().getValves()) {
                    present |= valve instanceof ProblemReportValve;
                }
                if (!present) {
                    host.getPipeline().addValve(new ProblemReportValve());
                }
            });
        }

        @Override
        public int getOrder() {
            return Ordered.LOWEST_PRECEDENCE;
        }
    }
}
