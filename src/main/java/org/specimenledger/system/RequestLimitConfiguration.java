package org.specimenledger.system;

import com.github.benmanes.caffeine.cache.Ticker;
import org.springframework.boot.web.servlet.FilterRegistrationBean;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import tools.jackson.databind.json.JsonMapper;

/** Puts {@link RequestLimits} in front of everything, security included: a refused flood costs no bcrypt. */
@Configuration(proxyBeanMethods = false)
class RequestLimitConfiguration {

    /** Before Spring Security's filter chain (order -100). */
    static final int ORDER = -200;

    @Bean
    FilterRegistrationBean<RequestLimits> requestLimits(RequestLimitSettings settings, JsonMapper json) {
        FilterRegistrationBean<RequestLimits> registration =
                new FilterRegistrationBean<>(new RequestLimits(settings, json, Ticker.systemTicker()));
        registration.setOrder(ORDER);
        registration.addUrlPatterns("/*");
        return registration;
    }
}
