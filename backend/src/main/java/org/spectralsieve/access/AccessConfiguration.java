package org.spectralsieve.access;

import org.springframework.beans.factory.annotation.Value;
import org.springframework.boot.web.servlet.FilterRegistrationBean;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.core.Ordered;

/** Installs the edge filters first in the chain, so a refused request is never parsed or logged further. */
@Configuration(proxyBeanMethods = false)
class AccessConfiguration {

    @Bean
    ListeningAddress listeningAddress(@Value("${server.address:}") String address) {
        return new ListeningAddress(address);
    }

    @Bean
    ListeningAddressReport listeningAddressReport(ListeningAddress address,
                                                  @Value("${sieve.server-mode:false}") boolean serverMode) {
        return new ListeningAddressReport(address, serverMode);
    }

    /**
     * Only for the embedded tool on loopback. Opened to the network, its names are not known. In server mode every
     * request needs a signed-in session or a token, which a page under another name cannot present (cookies belong
     * to the name the browser used), so the check has nothing left to guard; and a node behind a reverse proxy on
     * the same machine listens on loopback while the proxy passes on the public host name (docs/shared-server.md).
     */
    @Bean
    FilterRegistrationBean<LoopbackHostFilter> loopbackHostFilter(ListeningAddress address,
                                                                  @Value("${sieve.server-mode:false}") boolean serverMode) {
        FilterRegistrationBean<LoopbackHostFilter> registration = new FilterRegistrationBean<>(new LoopbackHostFilter());
        registration.setOrder(Ordered.HIGHEST_PRECEDENCE);
        registration.setEnabled(address.isLoopback() && !serverMode);
        return registration;
    }

    @Bean
    FilterRegistrationBean<CrossSiteWriteFilter> crossSiteWriteFilter() {
        FilterRegistrationBean<CrossSiteWriteFilter> registration = new FilterRegistrationBean<>(new CrossSiteWriteFilter());
        registration.setOrder(Ordered.HIGHEST_PRECEDENCE + 1);
        return registration;
    }
}
